import { EXCLUSION_KIND_NOTES } from '../site/exclusionKindNotes';
import type { SafetyThresholds } from './plotSafetyNotes';
import { DEFAULT_SAFETY_THRESHOLDS } from './plotSafetyNotes';
import type { ExclusionKind, Site } from '../model/types';

/** One headed group of briefing lines. */
export interface BriefingSection {
  heading: string;
  lines: string[];
}

/** A blank the crew fills in by hand before leaving. */
export interface BriefingField {
  label: string;
  /** Suggested number of writing lines. */
  lines: number;
}

/** The crew briefing as structured text, for field sheets and the app. */
export interface CrewBriefing {
  title: string;
  sections: BriefingSection[];
  fields: BriefingField[];
  /** Printed last and in full: the briefing does not replace the rules that govern the work. */
  governingStatement: string;
}

export interface CrewBriefingOptions {
  surveyDate?: Date;
  thresholds?: Partial<SafetyThresholds>;
  /** Declination text for the compass section, e.g. "11.6° E (WMM-2025, 2026.20)". */
  declinationText?: string;
  /** Field decisions already recorded (see plotRejectionLines): printed first, as plots not to visit. */
  fieldDecisions?: readonly string[];
}

/** The statement printed on every briefing (our wording). */
export const BRIEFING_GOVERNING_STATEMENT =
  'This briefing is a reminder, not a safety plan. It does not replace local regulations, landholder ' +
  'agreements or your employer’s safety plan and risk assessment, which govern the work. Where they ' +
  'differ from anything printed here, follow them.';

/**
 * Crew briefing for a site: the rejected plots not to visit (when given), usual cautions for
 * cliffs and water, remote and lone work, weather and tides, communication, the kinds of excluded
 * ground mapped, blanks for emergency contacts and check-in time, and the governing statement.
 * Cautions are common practice, no source; they defer to local codes and the employer's safety plan.
 */
export function crewBriefing(site: Pick<Site, 'name' | 'exclusions' | 'access'>, options: CrewBriefingOptions = {}): CrewBriefing {
  const t = { ...DEFAULT_SAFETY_THRESHOLDS, ...options.thresholds };
  const kinds = [...new Set(site.exclusions.map((e) => e.kind))] as ExclusionKind[];
  const sections: BriefingSection[] = [];
  if (options.fieldDecisions?.length) {
    sections.push({
      heading: 'Rejected plots: do not visit',
      lines: [...options.fieldDecisions, 'Visit the promoted reserves in their place; they are marked on the map and in their plot blocks.'],
    });
  }
  sections.push({
    heading: 'Before you leave',
    lines: [
      'Tell your contact person where you are going (site, plots, access point), who is in the crew and when you will check in.',
      'Check the weather forecast and warnings for the day; on the coast also check tide times and heights.',
      'Carry a means of communication that works on this site (mobile coverage may fail: radio, satellite messenger or beacon), a charged spare, first aid, water and sun and rain protection.',
      'Load the plot positions into a GPS unit or phone and carry the printed sheets as a fallback.',
    ],
  });
  sections.push({
    heading: 'Cliffs and edges',
    lines: [
      `Plots within ${Math.round(t.cliffNearM)} m of a mapped cliff edge carry a note. Stay outside the buffer; edges can be undercut, loose or slippery when wet.`,
      'Do not work with your back to an edge, do not lean over to look down, and keep clear of the foot of cliffs (falling rock).',
      'If the only way to a plot runs along an edge, do not go: record the plot as unreachable.',
    ],
  });
  sections.push({
    heading: 'Water and tides',
    lines: [
      'Do not wade or swim to reach a plot. Routes whose straight line crosses water carry a note: walk around or record the plot as unreachable.',
      'On tidal ground know the turn of the tide and keep a safe way back that the rising water cannot cut off.',
      'Banks can be soft or undercut; keep back from flowing water after rain.',
    ],
  });
  sections.push({
    heading: 'Remote and lone work',
    lines: [
      `Plots more than ${(t.remoteM / 1000).toFixed(1)} km from every access point carry a note: allow for the walk back in your time plan.`,
      'Work in pairs where the employer’s plan requires it; if working alone, follow the lone-working procedure and check in at the agreed times.',
      'Turn back when weather, light or fatigue changes the plan; an unvisited plot can be recorded and replaced by a reserve.',
    ],
  });
  sections.push({
    heading: 'Private land and access',
    lines: [
      `Plots within ${Math.round(t.privateNearM)} m of private land carry a note. Landholder permission required before entry; leave gates as found.`,
      ...(site.access.length
        ? [`Access points: ${site.access.map((a) => `${a.name} (${a.id})`).join('; ')}.`]
        : ['No access point is mapped: agree the way in before going.']),
    ],
  });
  if (kinds.length) {
    // Mapped notes of individual exclusions follow the standing notes; a long list is cut so the
    // briefing stays one page (the plot blocks carry what matters at each plot).
    const own = site.exclusions.filter((e) => e.notes?.trim()).map((e) => `${e.name?.trim() || e.id}: ${e.notes!.trim()}`);
    const MAX_OWN = 10;
    sections.push({
      heading: 'Excluded ground mapped on this site',
      lines: [
        ...kinds.map((k) => EXCLUSION_KIND_NOTES[k]),
        ...own.slice(0, MAX_OWN),
        ...(own.length > MAX_OWN ? [`…and ${own.length - MAX_OWN} more mapped notes: see the map file.`] : []),
      ],
    });
  }
  if (options.declinationText) {
    sections.push({
      heading: 'Compass',
      lines: [
        `Magnetic declination here: ${options.declinationText}. Magnetic bearings on these sheets already allow for it.`,
        'Keep the compass away from phones, GPS units, vehicles and steel tools when taking a bearing.',
      ],
    });
  }
  const fields: BriefingField[] = [
    { label: 'Emergency number (local)', lines: 1 },
    { label: 'Contact person and phone', lines: 1 },
    { label: 'Nearest medical help / meeting point', lines: 1 },
    { label: 'Check-in times agreed', lines: 1 },
    { label: 'Overdue action (who calls whom, when)', lines: 1 },
    { label: 'Crew names', lines: 1 },
    { label: 'Tide / weather notes for the day', lines: 1 },
  ];
  const dateText = options.surveyDate ? ` — ${options.surveyDate.toISOString().slice(0, 10)}` : '';
  return { title: `Crew briefing: ${site.name}${dateText}`, sections, fields, governingStatement: BRIEFING_GOVERNING_STATEMENT };
}

/** The briefing as plain text lines (for the CLI and text exports). */
export function crewBriefingText(b: CrewBriefing): string {
  const out = [b.title, ''];
  for (const s of b.sections) out.push(s.heading, ...s.lines.map((l) => `  - ${l}`), '');
  for (const f of b.fields) out.push(`${f.label}: ______________________________`);
  out.push('', b.governingStatement);
  return out.join('\n');
}
