import { WorkspacePage } from '../../features/workspace/components/workspace-page';

/** Lazy route module: /studies/:studyId (the study workspace; `demo` opens the reference study offline). */
export function Component() {
  return <WorkspacePage />;
}
