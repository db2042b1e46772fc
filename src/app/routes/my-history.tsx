// My history (athlete): e1RM per competition lift and bodyweight charts, records per variant, and the
// athlete's videos with the coaches' comments.
import type { QueryClient } from '@tanstack/react-query';
import { Loading, Notice, PageHeader, TrainingCaution } from '../../components/ui/page';
import { myHistoryQueryOptions, useMyHistory } from '../../features/history/api/queries';
import { LiftCharts } from '../../features/history/components/lift-charts';
import { MyVideos } from '../../features/history/components/my-videos';
import { VariantHistory } from '../../features/history/components/variant-history';

export function makeLoader(queryClient: QueryClient) {
  return async () => {
    await queryClient.ensureQueryData(myHistoryQueryOptions());
    return null;
  };
}

export function Component() {
  const { data, error } = useMyHistory();
  if (error) return <Notice tone="error">{error.message}</Notice>;
  if (!data) return <Loading />;
  return (
    <div className="mx-auto flex max-w-5xl flex-col gap-5">
      <PageHeader title="My history" subtitle="Your top sets, records and bodyweight over time." />
      <TrainingCaution />
      <LiftCharts series={data.series} unit={data.unit} />
      <VariantHistory variants={data.variants} unit={data.unit} />
      <MyVideos videos={data.videos} unit={data.unit} />
    </div>
  );
}
