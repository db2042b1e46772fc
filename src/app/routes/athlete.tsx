import { useParams } from 'react-router-dom';
import { Placeholder } from '../../components/ui/page';
import { AthleteReview } from '../../features/review/components/athlete-review';

export function Component() {
  const id = Number(useParams().athleteId);
  return (
    <>
      <Placeholder title="Athlete" />
      {Number.isInteger(id) && id > 0 ? <AthleteReview athleteId={id} /> : null}
    </>
  );
}
