// Rules (head coach): the team's rotation windows, joint budgets, taper, tissue settings, slots and
// the gym's equipment.
import { useSuspenseQuery } from '@tanstack/react-query';
import { PageHeader, TrainingCaution } from '../../components/ui/page';
import { rulesOptions } from '../../features/rules/api/queries';
import { RulesForm } from '../../features/rules/components/rules-form';
import type { LoaderMaker } from '../guards';

export const makeLoader: LoaderMaker = (queryClient) => async () => {
  await queryClient.ensureQueryData(rulesOptions());
  return null;
};

export function Component() {
  const { data } = useSuspenseQuery(rulesOptions());
  return (
    <section className="mx-auto max-w-5xl">
      <PageHeader
        title="Rules"
        subtitle="What the board may pick for every athlete. Per-athlete changes to windows and budgets live on each athlete's page."
      />
      <TrainingCaution className="mb-4" />
      <RulesForm doc={data} />
    </section>
  );
}
