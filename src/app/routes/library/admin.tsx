import { useMe } from '../../../features/auth/api/get-me';
import { AdminPage } from '../../../features/team/components/admin-page';

/** Lazy route module: /admin (site admins: teams and their first leads) */
export function Component() {
  const me = useMe();
  return <AdminPage isAdmin={me.data ? (me.data.user?.isAdmin ?? false) : null} />;
}
