import { Placeholder } from '../../components/ui/page';
import { InvitePanel } from '../../features/invitations/components/invite-panel';

export function Component() {
  return (
    <>
      <Placeholder title="Roster" />
      <InvitePanel />
    </>
  );
}
