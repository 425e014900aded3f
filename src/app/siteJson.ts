import type { Site } from '../core/model/types';
import { jsonStringifyKeepingGeometry } from '../io/common/jsonStringifyKeepingGeometry';
import type { SiteJson } from '../worker/siteSource';

const kept = new WeakMap<Site, SiteJson>();

/**
 * The site as JSON text for a planner worker, written once per site (the store replaces the site
 * on every change). A string crosses to a worker in a few milliseconds where cloning the site's
 * objects took a third of a second on a million-vertex map, all of it on the page's thread; it is
 * kept in one-byte form (characters above Latin-1 escaped), which halves that copy.
 */
export function siteJsonOf(site: Site): SiteJson {
  let text = kept.get(site);
  if (text === undefined) {
    text = jsonStringifyKeepingGeometry(site) as SiteJson;
    kept.set(site, text);
  }
  return text;
}
