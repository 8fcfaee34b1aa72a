import { OWNER_ROLES, roleIn } from '@contract';
import { useSignedIn } from '../../features/auth/api/get-me';
import { RoleWelcome } from '../../features/dashboard/components/role-welcome';
import { MailTrouble } from '../../features/mail/components/mail-trouble';

export default function HomeRoute() {
  const { user } = useSignedIn();
  const firstName = user.name.trim().split(/\s+/)[0] ?? user.name;
  return (
    <>
      {roleIn(OWNER_ROLES, user.role) ? <MailTrouble /> : null}
      <RoleWelcome role={user.role} firstName={firstName} />
    </>
  );
}
