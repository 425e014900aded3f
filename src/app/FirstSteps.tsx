import { useState } from 'react';
import { DEMO_SITE_NAME } from './demoSite';
import { usePlanner } from './usePlanner';

/** A short note for a first visit on the untouched demo: what the four steps are and that the site is invented. */
export function FirstSteps() {
  const pristine = usePlanner((s) => s.site.name === DEMO_SITE_NAME && s.result === null && s.revision === s.savedRevision);
  const [closed, setClosed] = useState(false);
  if (!pristine || closed) return null;
  return (
    <aside className="first-steps" aria-label="How to use the planner">
      <p>
        <strong>New here?</strong> This is an invented demo site. Work down the steps above: <b>1</b> check or draw the strata, <b>2</b> mark cliffs, water, private land and hazards, <b>3</b> make the design, <b>4</b> take the plots to the field. Your work is kept in this browser; save a plan file to keep a copy.
      </p>
      <button type="button" className="link" onClick={() => setClosed(true)}>
        Got it
      </button>
    </aside>
  );
}
