import { ChangePasswordForm } from '../components/forms/ChangePasswordForm';
import { PageHeader } from '../components/PageHeader';
import { Panel } from '../components/Panel';
import { useSignedInUser } from '../components/meContext';

/** The signed-in person's own account: who they are, and their password. */
export function MyAccountPage() {
  const me = useSignedInUser();
  return (
    <>
      <title>Your account · Timefield</title>
      <PageHeader title="Your account">
        Signed in as {me.name} ({me.email}). Changing your password signs you out everywhere else.
      </PageHeader>
      <Panel title="Change password">
        <ChangePasswordForm />
      </Panel>
    </>
  );
}
