/**
 * Validation of the edited study through the shared schema, once per params
 * object (the store replaces the object on every edit, so identity is a
 * correct cache key).
 */
import { validateStudy, type StudyParams, type StudyValidation } from '../../../../shared/schemas/study';

const cache = new WeakMap<object, { validation: StudyValidation; byPath: Map<string, string> }>();

function entry(params: StudyParams) {
  let hit = cache.get(params);
  if (!hit) {
    const validation = validateStudy(params);
    const byPath = new Map<string, string>();
    if (!validation.ok) for (const issue of validation.issues) if (!byPath.has(issue.path)) byPath.set(issue.path, issue.message);
    hit = { validation, byPath };
    cache.set(params, hit);
  }
  return hit;
}

export function validationOf(params: StudyParams): StudyValidation {
  return entry(params).validation;
}

/** The first issue exactly at `path` (dotted, e.g. 'cycle.segments.0.rateCPerMin'). */
export function issueAt(params: StudyParams, path: string): string | undefined {
  return entry(params).byPath.get(path);
}

/** Every issue at or below `prefix`. */
export function issuesUnder(params: StudyParams, prefix: string): { path: string; message: string }[] {
  const v = entry(params).validation;
  if (v.ok) return [];
  return v.issues.filter((i) => i.path === prefix || i.path.startsWith(`${prefix}.`));
}
