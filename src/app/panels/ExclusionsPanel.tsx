import { DEFAULT_BUFFER_M, EXCLUSION_KINDS, type ExclusionKind } from '../../core/model/types';
import { exclusionRemove, exclusionUpdate } from '../../state/exclusionActions';
import { accessRemove, accessUpdate } from '../../state/accessActions';
import { plannerStore } from '../plannerStoreInstance';
import { attempt, usePlanner } from '../usePlanner';
import { geometryBounds } from '../map/siteBounds';
import { ImportBox } from './ImportBox';
import { ToolButton } from './ToolButton';

/** Step 2: ground to keep clear — cliffs, water, private land, hazards — with safety buffers, and access points. */
export function ExclusionsPanel() {
  const site = usePlanner((s) => s.site);
  const selection = usePlanner((s) => s.selection);
  return (
    <section className="sheet" aria-labelledby="excl-title">
      <h2 id="excl-title">
        <span className="step-no">2</span> Mark exclusions
      </h2>
      <p className="lead">No plot footprint may touch these, widened by their safety buffer. Buffered ground is hatched on the map.</p>
      <aside className="caution" aria-label="Safety caution">
        Buffers here are planning distances, not safe working distances. Cliff edges, water, tides and remote ground need the precautions of local codes and your employer’s safety plan; private land needs the landholder’s permission before entry.
      </aside>
      <fieldset className="tools" aria-label="Exclusion drawing tools">
        <ToolButton tool="cliff" label="Cliff edge" shortcut="C" hint="Draw a line along the edge" />
        <ToolButton tool="creek" label="Creek" shortcut="K" hint="Draw a line along the watercourse" />
        <ToolButton tool="water" label="Water body" shortcut="W" hint="Outline a pond, lake or wetland" />
        <ToolButton tool="private" label="Private land" shortcut="P" hint="Outline the parcel" />
        <ToolButton tool="hazard" label="Hazard point" shortcut="Z" hint="Click the hazard" />
        <ToolButton tool="access" label="Access point" shortcut="A" hint="Click where crews start walking" />
      </fieldset>
      <ImportBox kind="exclusions" />
      <div className="table-wrap">
      <table className="ledger" aria-label="Exclusions">
        <thead>
          <tr>
            <th scope="col">Name</th>
            <th scope="col">Kind</th>
            <th scope="col" className="num">Buffer m</th>
            <th scope="col">Notes</th>
            <th scope="col">
              <span className="sr-only">Actions</span>
            </th>
          </tr>
        </thead>
        <tbody>
          {site.exclusions.map((e) => (
            <tr key={e.id} className={selection?.kind === 'exclusion' && selection.id === e.id ? 'row-on' : undefined}>
              <td>
                <input className="name-input" aria-label={`Name of exclusion ${e.id}`} defaultValue={e.name ?? ''} key={`${e.id}-${e.name}`} onBlur={(ev) => ev.currentTarget.value !== (e.name ?? '') && attempt(() => exclusionUpdate(plannerStore, e.id, { name: ev.currentTarget.value }))} />
              </td>
              <td>
                <select
                  aria-label={`Kind of ${e.name ?? e.id}`}
                  value={e.kind}
                  onChange={(ev) => {
                    const kind = ev.currentTarget.value as ExclusionKind;
                    attempt(() => exclusionUpdate(plannerStore, e.id, { kind, bufferM: e.bufferM === DEFAULT_BUFFER_M[e.kind] ? DEFAULT_BUFFER_M[kind] : e.bufferM }));
                  }}
                >
                  {EXCLUSION_KINDS.map((k) => (
                    <option key={k} value={k}>
                      {k}
                    </option>
                  ))}
                </select>
              </td>
              <td className="num">
                <input
                  type="number"
                  min={0}
                  step={1}
                  className="num-input"
                  aria-label={`Buffer of ${e.name ?? e.id} in metres`}
                  defaultValue={e.bufferM}
                  key={`${e.id}-${e.bufferM}`}
                  onBlur={(ev) => Number(ev.currentTarget.value) !== e.bufferM && attempt(() => exclusionUpdate(plannerStore, e.id, { bufferM: Number(ev.currentTarget.value) }))}
                />
              </td>
              <td>
                <input className="notes-input" aria-label={`Notes for ${e.name ?? e.id}`} defaultValue={e.notes ?? ''} key={`${e.id}-${e.notes}`} onBlur={(ev) => ev.currentTarget.value !== (e.notes ?? '') && attempt(() => exclusionUpdate(plannerStore, e.id, { notes: ev.currentTarget.value }))} />
              </td>
              <td className="actions">
                <button
                  type="button"
                  aria-label={`Show ${e.name ?? e.id} on the map`}
                  onClick={() => {
                    const bbox = geometryBounds(e.geometry);
                    if (bbox) plannerStore.setState({ focus: { bbox, at: Date.now() }, selection: { kind: 'exclusion', id: e.id } });
                  }}
                >
                  Show
                </button>
                <button type="button" aria-label={`Delete ${e.name ?? e.id}`} onClick={() => exclusionRemove(plannerStore, e.id)}>
                  Delete
                </button>
              </td>
            </tr>
          ))}
        </tbody>
      </table>
      </div>
      <p className="fine">Default buffers by kind: {EXCLUSION_KINDS.map((k) => `${k} ${DEFAULT_BUFFER_M[k]} m`).join(', ')} (common practice, adjust to your site).</p>
      <h3>Access points</h3>
      <ImportBox kind="access" />
      <ul className="plain-list">
        {site.access.map((a) => (
          <li key={a.id}>
            <input className="name-input" aria-label={`Name of access point ${a.id}`} defaultValue={a.name} key={`${a.id}-${a.name}`} onBlur={(ev) => ev.currentTarget.value !== a.name && attempt(() => accessUpdate(plannerStore, a.id, { name: ev.currentTarget.value }))} />
            <span className="fine"> {a.kind.replace('_', ' ')}</span>
            <button type="button" aria-label={`Delete access point ${a.name}`} onClick={() => accessRemove(plannerStore, a.id)}>
              Delete
            </button>
          </li>
        ))}
      </ul>
    </section>
  );
}
