import { useMe } from '../../../features/auth/api/get-me';
import { TeamPicker } from '../../../features/team/components/team-picker';

/** Lazy route module: /team */
export function Component() {
  const me = useMe();
  if (me.isPending) return null;
  return <TeamPicker isAdmin={me.data?.user?.isAdmin ?? false} />;
}
