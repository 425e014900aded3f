import { useEffect } from 'react';

type WakeLockSentinel = { release(): Promise<void> };
type WakeLockApi = { request(type: 'screen'): Promise<WakeLockSentinel> };

/**
 * Keeps the screen on while the field view is shown, where the browser offers a screen wake lock
 * (a crew walking to a plot should not have to unlock the phone at every glance). The lock is
 * taken again when the page becomes visible, as browsers release it when it is hidden.
 */
export function useScreenAwake(): void {
  useEffect(() => {
    const api = (navigator as Navigator & { wakeLock?: WakeLockApi }).wakeLock;
    if (!api) return;
    let lock: WakeLockSentinel | null = null;
    let gone = false;
    const take = () => {
      if (document.visibilityState !== 'visible') return;
      api
        .request('screen')
        .then((l) => {
          if (gone) void l.release();
          else lock = l;
        })
        .catch(() => undefined);
    };
    take();
    document.addEventListener('visibilitychange', take);
    return () => {
      gone = true;
      document.removeEventListener('visibilitychange', take);
      void lock?.release().catch(() => undefined);
    };
  }, []);
}
