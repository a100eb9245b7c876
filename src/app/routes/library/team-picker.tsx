import { TeamPicker } from '../../../features/team/components/team-picker';

/** Lazy route module: /team */
export function Component() {
  return <TeamPicker />;
}
