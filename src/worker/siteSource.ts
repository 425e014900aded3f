import type { Site } from '../core/model/types';

/** A site as JSON text (JSON.stringify of a Site): how the page hands a site to a planner worker. */
export type SiteJson = string & { readonly siteJson: unique symbol };

/**
 * Where a planner worker gets its site: the text itself, or a port on which another planner
 * worker that already holds the text posts it (worker to worker, so the page's thread copies
 * nothing: on a 40 MB site that copy and the collection after it held the page ~70 ms).
 */
export type SiteSource = SiteJson | MessagePort;

/** The site a page's text describes (it was written by JSON.stringify of a Site, so no checks are repeated). */
export function siteRead(text: SiteJson): Site {
  return JSON.parse(text) as Site;
}

/** The site's text from a source: at once for text, else the first message on the port (which is then closed). */
export function siteTextReceive(source: SiteSource): Promise<SiteJson> {
  if (typeof source === 'string') return Promise.resolve(source);
  return new Promise((resolve, reject) => {
    source.onmessage = (e: MessageEvent) => {
      source.close();
      if (typeof e.data === 'string') resolve(e.data as SiteJson);
      // The holder answers with null when it holds no site; the page only asks one that does.
      else reject(new Error('the site was not handed over by the worker that holds it'));
    };
  });
}
