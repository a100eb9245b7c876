import { TeamHomePage } from '../../../features/team/components/team-home-page';

/** Lazy route module: /teams/:teamId */
export function Component() {
  return <TeamHomePage />;
}
