import { useEffect, useRef } from 'react';

/** A question that must be answered before anything is replaced; focus starts on the safe choice. */
export function ConfirmDialog({ title, body, confirmLabel, onConfirm, onCancel }: { title: string; body: string; confirmLabel: string; onConfirm: () => void; onCancel: () => void }) {
  const safe = useRef<HTMLButtonElement>(null);
  useEffect(() => safe.current?.focus(), []);
  return (
    <div className="veil">
      <div className="ask" role="alertdialog" aria-modal="true" aria-labelledby="ask-title" aria-describedby="ask-body" onKeyDown={(e) => e.key === 'Escape' && onCancel()}>
        <h2 id="ask-title">{title}</h2>
        <p id="ask-body">{body}</p>
        <div className="ask-buttons">
          <button type="button" ref={safe} onClick={onCancel}>
            Keep my work
          </button>
          <button type="button" className="warn" onClick={onConfirm}>
            {confirmLabel}
          </button>
        </div>
      </div>
    </div>
  );
}
