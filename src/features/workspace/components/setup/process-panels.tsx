import { Panel } from '../../../../components/ui/panel';
import { SelectField } from '../../../../components/ui/select-field';
import { aluminiumPlate, invarPlate } from '../../../../../shared/solver/demo-cards';
import type { ToolPlate } from '../../../../../shared/schemas/study';
import { useIssue, useIssueCount } from '../../hooks/use-study-field';
import { useStudyEditor } from '../../stores/study-editor-store';
import { StudyFields, type FieldSpec } from './study-fields';

const toolChoices: Record<string, (() => ToolPlate) | null> = {
  'No tool (free both faces)': null,
  'Aluminium plate': () => aluminiumPlate(10),
  'Invar-like plate': () => invarPlate(12),
};

const toolFields: FieldSpec[] = [
  { path: 'tool.thicknessMm', label: 'Thickness', unit: 'mm', step: 0.5 },
  { path: 'tool.cteMicroPerK', label: 'CTE', unit: 'µ/K', step: 0.1 },
  { path: 'tool.conductivityWPerMK', label: 'Conductivity', unit: 'W/(m·K)', step: 1 },
  { path: 'tool.densityKgM3', label: 'Density', unit: 'kg/m³', step: 10 },
  { path: 'tool.specificHeatJPerKgK', label: 'Specific heat', unit: 'J/(kg·K)', step: 10 },
];

export function ToolPanel() {
  const tool = useStudyEditor((s) => s.params?.tool);
  const edit = useStudyEditor((s) => s.edit);
  const issues = useIssueCount('tool');
  if (!tool) return null;
  const current = tool.kind === 'none' ? 'No tool (free both faces)' : tool.name;
  const options = Object.keys(toolChoices).map((k) => ({ value: k, label: k }));
  if (!(current in toolChoices)) options.push({ value: current, label: current });
  return (
    <Panel title="Tool" foldable defaultOpen={false} issueCount={issues} testId="panel-tool">
      <div className="mb-2">
        <SelectField
          label="Tool material"
          value={current}
          options={options}
          onChange={(name) => {
            if (!(name in toolChoices)) return;
            const make = toolChoices[name];
            edit(`Tool: ${name}`, (d) => {
              d.tool = make ? make() : { kind: 'none' };
              if (!make) d.constraint = 'free';
            });
          }}
        />
      </div>
      {tool.kind === 'plate' && <StudyFields fields={toolFields} />}
    </Panel>
  );
}

export function HeatTransferPanel() {
  const issues = useIssueCount('heatTransfer') + useIssueCount('mesh');
  return (
    <Panel title="Heat transfer" foldable defaultOpen={false} issueCount={issues} testId="panel-heat">
      <StudyFields
        fields={[
          { path: 'heatTransfer.bagSideWPerM2K', label: 'Bag side', unit: 'W/(m²·K)', step: 5 },
          { path: 'heatTransfer.toolSideWPerM2K', label: 'Tool side', unit: 'W/(m²·K)', step: 5 },
          { path: 'mesh.nodesPerPly', label: 'Nodes per ply', unit: '', digits: 0 },
        ]}
      />
    </Panel>
  );
}

export function GeometryPanel() {
  const constraint = useStudyEditor((s) => s.params?.constraint);
  const edit = useStudyEditor((s) => s.edit);
  const issue = useIssue('constraint');
  const issues = useIssueCount('geometry') + (issue ? 1 : 0);
  if (!constraint) return null;
  return (
    <Panel title="Part geometry" foldable defaultOpen={false} issueCount={issues} testId="panel-geometry">
      <StudyFields
        fields={[
          { path: 'geometry.stripSpanMm', label: 'Strip span', unit: 'mm', step: 10 },
          { path: 'geometry.cornerAngleDeg', label: 'Corner angle', unit: '°' },
        ]}
      />
      <div className="mt-2">
        <SelectField
          label="Held during cure"
          value={constraint}
          issue={issue}
          options={[
            { value: 'tool-held', label: 'flat on the tool until demould' },
            { value: 'free', label: 'free to deform' },
          ]}
          onChange={(v) => edit(`Constraint: ${v}`, (d) => void (d.constraint = v))}
        />
      </div>
    </Panel>
  );
}

export function LimitsSetupPanel() {
  const issues = useIssueCount('limits');
  return (
    <Panel title="Process limits" foldable defaultOpen={false} issueCount={issues} testId="panel-limits-setup">
      <StudyFields
        fields={[
          { path: 'limits.minFinalCure', label: 'Least final cure α', unit: '', step: 0.01 },
          { path: 'limits.maxOvershootC', label: 'Exotherm overshoot', unit: '°C' },
          { path: 'limits.maxGradientC', label: 'Through-thickness ΔT', unit: '°C' },
          { path: 'limits.maxHeatRateCPerMin', label: 'Heat-up rate', unit: '°C/min', step: 0.1 },
          { path: 'limits.maxCoolRateCPerMin', label: 'Cool-down rate', unit: '°C/min', step: 0.1 },
          { path: 'limits.maxWarpageMm', label: 'Warpage', unit: 'mm', step: 0.1 },
          { path: 'limits.maxSpringInDeg', label: 'Spring-in', unit: '°', step: 0.1 },
          { path: 'limits.maxCycleMin', label: 'Cycle time', unit: 'min', step: 10 },
        ]}
      />
    </Panel>
  );
}
