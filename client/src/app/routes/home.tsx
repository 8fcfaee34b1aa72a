import { useSignedIn } from '../../features/auth/api/get-me';
import { RoleWelcome } from '../../features/dashboard/components/role-welcome';

export default function HomeRoute() {
  const { user } = useSignedIn();
  const firstName = user.name.trim().split(/\s+/)[0] ?? user.name;
  return <RoleWelcome role={user.role} firstName={firstName} />;
}
