import { Placeholder } from '../../components/ui/page';
import { PublishWeekButton } from '../../features/publishing/components/publish-week-button';

export function Component() {
  return (
    <>
      <Placeholder title="Board" />
      <PublishWeekButton />
    </>
  );
}
