import type { ChangeArea, ParamChange } from '../../../shared/compare/param-diff';

const AREA_ORDER: ChangeArea[] = ['cycle', 'layup', 'material', 'tool', 'heat transfer', 'geometry', 'limits', 'model'];
const AREA_TITLE: Record<ChangeArea, string> = {
  cycle: 'Cure cycle',
  layup: 'Layup',
  material: 'Material cards',
  tool: 'Tool',
  'heat transfer': 'Heat transfer',
  geometry: 'Part geometry',
  limits: 'Process limits',
  model: 'Model settings',
};
const KIND_MARK: Record<ParamChange['kind'], string> = { added: '+ added', removed: '− removed', changed: '~ changed' };

/** Which inputs differ, grouped by area, each change one sentence with units. */
export function ParamDiffList({ changes }: { changes: ParamChange[] }) {
  if (changes.length === 0) {
    return <p className="text-sm text-ink-soft" data-testid="param-diff">The two revisions have the same inputs.</p>;
  }
  return (
    <div className="flex flex-col gap-3 text-sm" data-testid="param-diff">
      {AREA_ORDER.filter((area) => changes.some((c) => c.area === area)).map((area) => (
        <section key={area} aria-label={AREA_TITLE[area]}>
          <h3 className="text-[11px] font-semibold uppercase tracking-[0.06em] text-ink-soft">{AREA_TITLE[area]}</h3>
          <ul className="mt-1 flex flex-col gap-0.5">
            {changes
              .filter((c) => c.area === area)
              .map((c, i) => (
                <li key={`${c.path}-${i}`} className="flex gap-2" data-kind={c.kind}>
                  <span className="num w-20 shrink-0 text-[11px] text-ink-faint">{KIND_MARK[c.kind]}</span>
                  <span>{c.text}</span>
                </li>
              ))}
          </ul>
        </section>
      ))}
    </div>
  );
}
