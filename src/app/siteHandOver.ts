import * as Comlink from 'comlink';
import type { Site } from '../core/model/types';
import type { SiteSource } from '../worker/siteSource';
import { siteJsonOf } from './siteJson';

/** A planner worker that holds a site's text, and the call that makes it post that text on a port. */
export interface SiteHolder {
  site: Site;
  handOver(port: MessagePort): void;
}

let holder: SiteHolder | null = null;

/** Records the worker that now holds a site (the analysis runner, after it posts each site), or none. */
export function siteHolderSet(next: SiteHolder | null): void {
  holder = next;
}

/**
 * How to give `site` to a fresh planner worker. When a worker already holds this very site (the
 * analysis worker has been sent it), a port on which that worker posts the text, so the page's
 * thread copies nothing; otherwise (the site changed in the last moments) the text itself.
 * Pass the result straight to the worker call: the port is marked for transfer.
 */
export function siteSourceFor(site: Site): SiteSource {
  if (holder === null || holder.site !== site) return siteJsonOf(site);
  const { port1, port2 } = new MessageChannel();
  holder.handOver(port1);
  return Comlink.transfer(port2, [port2]);
}
