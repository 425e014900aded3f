import { useEffect, useRef, useState } from 'react';
import { type WorkVersion, planHash, planHashText, workVersionRead, workVersionsList } from '../state/autosaveVersions';
import { planFileFromState } from '../state/planFile';
import { planReplace } from '../state/planReplace';
import { resultsSnapshotTake } from '../state/resultsSnapshot';
import { browserStorage } from './browserStorage';
import { demoDesign } from './demoSite';
import { plannerStore } from './plannerStoreInstance';
import { resultsStore } from './results/resultsStoreInstance';
import { notify } from './usePlanner';

/** "today 14:05", "yesterday 09:30" or "1 Dec 2026, 14:05" in the browser's time zone. */
function whenText(iso: string, now = new Date()): string {
  const d = new Date(iso);
  const time = d.toLocaleTimeString('en-GB', { hour: '2-digit', minute: '2-digit' });
  const day = (x: Date) => new Date(x.getFullYear(), x.getMonth(), x.getDate()).getTime();
  const days = Math.round((day(now) - day(d)) / 86_400_000);
  if (days === 0) return `today ${time}`;
  if (days === 1) return `yesterday ${time}`;
  return `${d.toLocaleDateString('en-GB', { day: 'numeric', month: 'short', year: 'numeric' })}, ${time}`;
}

/**
 * The versions of the work this browser keeps (newest first), each with its time, site and what it
 * holds; one is brought back as one undo step, and the work on screen stays in the list.
 */
export function EarlierWork({ onClose }: { onClose: () => void }) {
  const [versions, setVersions] = useState<WorkVersion[] | null>(null);
  const [current, setCurrent] = useState('');
  const close = useRef<HTMLButtonElement>(null);
  useEffect(() => {
    close.current?.focus();
    const s = plannerStore.getState();
    void planHash(browserStorage, planHashText(planFileFromState(s, '', resultsSnapshotTake(resultsStore.getState())))).then(setCurrent, () => setCurrent(''));
    workVersionsList(browserStorage)
      .then(setVersions)
      .catch(() => setVersions([]));
  }, []);

  const bringBack = async (v: WorkVersion) => {
    try {
      const { plan, saved } = await workVersionRead(browserStorage, v.id);
      planReplace(plannerStore, plan, demoDesign(null), `your work of ${whenText(v.at)}`, saved, resultsStore);
      onClose();
    } catch (e) {
      notify('error', (e as Error).message);
    }
  };

  return (
    <div className="veil">
      <div className="ask earlier" role="dialog" aria-modal="true" aria-labelledby="earlier-title" onKeyDown={(e) => e.key === 'Escape' && onClose()}>
        <h2 id="earlier-title">Earlier work kept in this browser</h2>
        <p className="fine">A new version begins when another plan is opened, in each session and every ten minutes of work; the last ten are kept. Bringing one back can be undone.</p>
        {versions === null ? <p>Reading…</p> : null}
        {versions?.length === 0 ? <p>Nothing is kept yet: versions appear here as you work.</p> : null}
        {versions?.length ? (
          <ol className="versions" aria-label="Earlier versions, newest first">
            {versions.map((v) => (
              <li key={v.id} data-version={v.id}>
                <div>
                  <strong>{whenText(v.at)}</strong> · {v.siteName}
                  <div className="fine">{v.summary}</div>
                </div>
                {v.hash === current ? (
                  <span className="fine">on screen now</span>
                ) : (
                  <button type="button" aria-label={`Bring back the work of ${whenText(v.at)}`} onClick={() => void bringBack(v)}>
                    Bring back
                  </button>
                )}
              </li>
            ))}
          </ol>
        ) : null}
        <div className="ask-buttons">
          <button type="button" ref={close} onClick={onClose}>
            Close
          </button>
        </div>
      </div>
    </div>
  );
}
