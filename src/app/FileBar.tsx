import { useEffect, useId, useRef, useState } from 'react';
import { planFileOf, planFileParse, planHasUnsavedWork } from '../state/planFile';
import { usePlanOffer } from './usePlanOffer';
import { demoDesign, demoSiteLoad } from './demoSite';
import { planSaveDownload } from './planSaveDownload';
import { EarlierWork } from './EarlierWork';
import { notify, usePlanner } from './usePlanner';

/**
 * The site's name, and the plan's file actions: save, open, the demo site and earlier work kept in
 * this browser. Replacing unsaved work asks first (our own dialog) and is one undo step. On a narrow
 * screen the actions fold into a "Plan" menu.
 */
export function FileBar() {
  const openId = useId();
  const menuId = useId();
  const siteName = usePlanner((s) => s.site.name);
  const unsaved = usePlanner(planHasUnsavedWork);
  const { offer, question } = usePlanOffer();
  const [earlier, setEarlier] = useState(false);
  const [menu, setMenu] = useState(false);
  const bar = useRef<HTMLDivElement>(null);

  useEffect(() => {
    if (!menu) return;
    const away = (e: Event) => bar.current && !bar.current.contains(e.target as Node) && setMenu(false);
    const esc = (e: KeyboardEvent) => e.key === 'Escape' && setMenu(false);
    document.addEventListener('pointerdown', away);
    document.addEventListener('keydown', esc);
    return () => {
      document.removeEventListener('pointerdown', away);
      document.removeEventListener('keydown', esc);
    };
  }, [menu]);

  const save = () => {
    setMenu(false);
    planSaveDownload();
  };

  const open = async (file: File | undefined) => {
    setMenu(false);
    if (!file) return;
    try {
      offer(planFileParse(await file.text(), file.name), `“${file.name}”`, true);
    } catch (e) {
      // The plan on screen and its browser copy stay as they were.
      notify('error', `${(e as Error).message}; your current plan is unchanged`);
    }
  };

  const demo = async () => {
    setMenu(false);
    const { site, baseline } = await demoSiteLoad();
    offer(planFileOf(site, demoDesign(baseline)), 'the invented demo site', true);
  };

  return (
    <>
      <span className="site-name">
        {siteName}
        {unsaved ? (
          <span className="unsaved">
            {' '}· unsaved<span className="unsaved-more"> changes (kept in this browser)</span>
          </span>
        ) : null}
      </span>
      <div className="file-bar" ref={bar}>
        <button type="button" className="file-menu" aria-expanded={menu} aria-controls={menuId} onClick={() => setMenu(!menu)}>
          Plan <span aria-hidden="true">▾</span>
        </button>
        <div className={menu ? 'file-actions file-actions-open' : 'file-actions'} id={menuId}>
          <button type="button" onClick={save}>
            Save plan
          </button>
          <label htmlFor={openId} className="file-label">
            Open plan
          </label>
          <input id={openId} className="file-input" type="file" accept=".json,application/json" data-open-plan onChange={(e) => {
            void open(e.currentTarget.files?.[0]);
            e.currentTarget.value = '';
          }} />
          <button type="button" onClick={() => void demo()}>
            Demo site
          </button>
          <button type="button" onClick={() => {
            setMenu(false);
            setEarlier(true);
          }}>
            Earlier work…
          </button>
        </div>
      </div>
      {question}
      {earlier ? <EarlierWork onClose={() => setEarlier(false)} /> : null}
    </>
  );
}
