/** What the model assumes and what its predictions are for; always on screen in the workspace. */
export function AssumptionsNote() {
  return (
    <aside id="model-cautions" aria-label="Model assumptions and cautions" className="border-t border-rule bg-saffron-soft/40 px-3 py-2 text-xs leading-relaxed text-ink-soft" data-testid="assumptions">
      <h2 className="mb-1 text-[11px] font-semibold uppercase tracking-[0.08em] text-saffron">Model and cautions</h2>
      <ul className="list-disc space-y-0.5 pl-4">
        <li>
          One-dimensional heat flow through the thickness of a flat laminate on its tool; in-plane heat flow, edges,
          resin flow and bleed are left out. Ply properties follow from fibre and resin by micromechanics.
        </li>
        <li>
          Residual stress and warpage from classical lamination theory with a viscoelastic resin; linear theory
          overstates the saddle shape of thin unsymmetric plates, which snap to a cylinder in reality.
        </li>
        <li>
          Thick sections can run away: the exotherm rises faster than the tool can take the heat out. Treat any
          overshoot warning as a reason to slow the ramp or add a dwell, and confirm with thermocouples.
        </li>
        <li>
          Predictions support, and never replace, part qualification, process specifications, local codes and
          licensed engineering practice.
        </li>
      </ul>
    </aside>
  );
}
