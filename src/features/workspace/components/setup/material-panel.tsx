import { Panel } from '../../../../components/ui/panel';
import { SelectField } from '../../../../components/ui/select-field';
import { demoCarbonFibre, demoResin180, leeLoosSpringerResin } from '../../../../../shared/solver/demo-cards';
import type { ResinCard } from '../../../../../shared/schemas/study';
import { KINETICS_NAMES } from '../../../../../shared/compare/field-labels';
import { useIssueCount } from '../../hooks/use-study-field';
import { useStudyEditor } from '../../stores/study-editor-store';
import { StudyFields, type FieldSpec } from './study-fields';

const resinCards: Record<string, () => ResinCard> = {
  'DF-E180 demo epoxy': demoResin180,
  'Lee–Loos–Springer epoxy (literature kinetics)': leeLoosSpringerResin,
};

const kineticsFields: Record<ResinCard['kinetics']['form'], FieldSpec[]> = {
  'nth-order': [
    { path: 'resin.kinetics.aPerS', label: 'A', unit: '1/s' },
    { path: 'resin.kinetics.eJPerMol', label: 'E', unit: 'J/mol', step: 100 },
    { path: 'resin.kinetics.n', label: 'n', unit: '', step: 0.05 },
  ],
  'kamal-sourour': [
    { path: 'resin.kinetics.a1PerS', label: 'A₁', unit: '1/s' },
    { path: 'resin.kinetics.e1JPerMol', label: 'E₁', unit: 'J/mol', step: 100 },
    { path: 'resin.kinetics.a2PerS', label: 'A₂', unit: '1/s' },
    { path: 'resin.kinetics.e2JPerMol', label: 'E₂', unit: 'J/mol', step: 100 },
    { path: 'resin.kinetics.m', label: 'm', unit: '', step: 0.05 },
    { path: 'resin.kinetics.n', label: 'n', unit: '', step: 0.05 },
  ],
  'lee-loos-springer': [
    { path: 'resin.kinetics.a1PerMin', label: 'A₁', unit: '1/min' },
    { path: 'resin.kinetics.a2PerMin', label: 'A₂', unit: '1/min' },
    { path: 'resin.kinetics.a3PerMin', label: 'A₃', unit: '1/min' },
    { path: 'resin.kinetics.e1JPerMol', label: 'E₁', unit: 'J/mol', step: 100 },
    { path: 'resin.kinetics.e2JPerMol', label: 'E₂', unit: 'J/mol', step: 100 },
    { path: 'resin.kinetics.e3JPerMol', label: 'E₃', unit: 'J/mol', step: 100 },
    { path: 'resin.kinetics.b', label: 'B', unit: '', step: 0.01 },
  ],
};

const resinFields: FieldSpec[] = [
  { path: 'resin.heatOfReactionKJPerKg', label: 'Heat of reaction', unit: 'kJ/kg', step: 5 },
  { path: 'resin.gelPoint', label: 'Gel point α', unit: '', step: 0.01 },
  { path: 'resin.glassTransition.tg0C', label: 'Tg uncured', unit: '°C' },
  { path: 'resin.glassTransition.tgInfC', label: 'Tg fully cured', unit: '°C' },
  { path: 'resin.glassTransition.lambda', label: 'DiBenedetto λ', unit: '', step: 0.01 },
  { path: 'resin.totalShrinkagePct', label: 'Cure shrinkage (vol.)', unit: '%', step: 0.1 },
  { path: 'resin.cteMicroPerK', label: 'Resin CTE', unit: 'µ/K' },
  { path: 'resin.modulus.unrelaxedGPa', label: 'Glassy modulus', unit: 'GPa', step: 0.1 },
  { path: 'resin.modulus.relaxedGPa', label: 'Rubbery modulus', unit: 'GPa', step: 0.05 },
  { path: 'resin.modulus.poisson', label: 'Resin Poisson ratio', unit: '', step: 0.01 },
  { path: 'resin.densityKgM3', label: 'Density', unit: 'kg/m³', step: 10 },
  { path: 'resin.specificHeatJPerKgK', label: 'Specific heat', unit: 'J/(kg·K)', step: 10 },
  { path: 'resin.conductivityWPerMK', label: 'Conductivity', unit: 'W/(m·K)', step: 0.01 },
];

const fibreFields: FieldSpec[] = [
  { path: 'fibreVolumeFraction', label: 'Fibre volume fraction', unit: '', step: 0.01 },
  { path: 'fibre.e1GPa', label: 'E₁ axial', unit: 'GPa' },
  { path: 'fibre.e2GPa', label: 'E₂ transverse', unit: 'GPa' },
  { path: 'fibre.g12GPa', label: 'G₁₂', unit: 'GPa' },
  { path: 'fibre.nu12', label: 'ν₁₂', unit: '', step: 0.01 },
  { path: 'fibre.cte1MicroPerK', label: 'CTE axial', unit: 'µ/K', step: 0.1 },
  { path: 'fibre.cte2MicroPerK', label: 'CTE transverse', unit: 'µ/K', step: 0.1 },
  { path: 'fibre.densityKgM3', label: 'Density', unit: 'kg/m³', step: 10 },
  { path: 'fibre.specificHeatJPerKgK', label: 'Specific heat', unit: 'J/(kg·K)', step: 10 },
  { path: 'fibre.conductivityAxialWPerMK', label: 'Conductivity axial', unit: 'W/(m·K)', step: 0.1 },
  { path: 'fibre.conductivityTransverseWPerMK', label: 'Conductivity transverse', unit: 'W/(m·K)', step: 0.1 },
];

/** Built once: the panel only needs the demo card's name to tell whether to offer it. */
const DEMO_FIBRE_NAME = demoCarbonFibre().name;

export function MaterialPanel() {
  const resin = useStudyEditor((s) => s.params?.resin);
  const fibre = useStudyEditor((s) => s.params?.fibre);
  const edit = useStudyEditor((s) => s.edit);
  const resinIssues = useIssueCount('resin');
  const fibreIssues = useIssueCount('fibre') + useIssueCount('fibreVolumeFraction');
  if (!resin || !fibre) return null;
  const known = resin.name in resinCards;
  return (
    <>
      <Panel title="Resin card" foldable issueCount={resinIssues} testId="panel-resin">
        <div className="mb-2 flex flex-col gap-1">
          <SelectField
            label="Resin"
            value={known ? resin.name : '(this study’s own card)'}
            options={[
              ...(known ? [] : [{ value: '(this study’s own card)', label: resin.name }]),
              ...Object.keys(resinCards).map((name) => ({ value: name, label: name })),
            ]}
            onChange={(name) => {
              const card = resinCards[name];
              if (card) edit(`Resin card: ${name}`, (d) => void (d.resin = card()));
            }}
          />
          <p className="text-[11px] leading-snug text-ink-faint">Source: {resin.provenance.source}</p>
        </div>
        <h3 className="mb-1 text-xs text-ink-soft">
          Kinetics, {KINETICS_NAMES[resin.kinetics.form]}
        </h3>
        <StudyFields fields={kineticsFields[resin.kinetics.form]} />
        <h3 className="mb-1 mt-3 text-xs text-ink-soft">Thermal and mechanical</h3>
        <StudyFields fields={resinFields} />
      </Panel>
      <Panel title="Fibre card" foldable defaultOpen={false} issueCount={fibreIssues} testId="panel-fibre">
        <p className="mb-2 text-xs text-ink-soft">
          {fibre.name}
          <span className="block text-[11px] text-ink-faint">Source: {fibre.provenance.source}</span>
        </p>
        <StudyFields fields={fibreFields} />
        {fibre.name !== DEMO_FIBRE_NAME && (
          <button
            type="button"
            className="mt-2 text-xs text-slate underline"
            onClick={() => edit('Fibre card: demo carbon', (d) => void (d.fibre = demoCarbonFibre()))}
          >
            Use the demo carbon fibre card
          </button>
        )}
      </Panel>
    </>
  );
}
