// The demo club's invented fee plans and a few athletes' fee states (one past due), dated from the day
// of seeding. These states are local only: the demo athlete starts with no fee, so paying can be tried.
import { addMonth } from '../../standins/payments/store';
import type { Tx } from '../client';
import { athleteBilling, feePlans } from '../schema';

export const DEMO_FEE_PLANS = [
  {
    key: 'floor',
    name: 'Open floor',
    priceMinor: 3900,
    description: 'Gym hours with a coach on the floor and a programme review once a month.',
  },
  {
    key: 'coached',
    name: 'Coached block',
    priceMinor: 7900,
    description: 'Weekly max-effort picks, top-set reviews and a check-in call every other week.',
  },
  {
    key: 'meet',
    name: 'Meet preparation',
    priceMinor: 12900,
    description: 'The coached block plus attempt planning and a coach in the warm-up room on meet day.',
  },
] as const;

type PlanKey = (typeof DEMO_FEE_PLANS)[number]['key'];

const DEMO_FEES: {
  athlete: string;
  plan: PlanKey;
  status: 'active' | 'past_due' | 'cancelled';
  paidDaysAgo: number;
}[] = [
  { athlete: 'dario', plan: 'coached', status: 'active', paidDaysAgo: 12 },
  { athlete: 'keisha', plan: 'meet', status: 'active', paidDaysAgo: 3 },
  { athlete: 'finn', plan: 'coached', status: 'active', paidDaysAgo: 21 },
  // The renewal two days ago failed: the period it paid for has run out.
  { athlete: 'jonas', plan: 'floor', status: 'past_due', paidDaysAgo: 33 },
  { athlete: 'priya', plan: 'floor', status: 'cancelled', paidDaysAgo: 52 },
];

export async function seedDemoFees(
  tx: Tx,
  opts: { teamId: number; currency: string; today: Date; athleteIds: Map<string, number> },
): Promise<void> {
  const planIds = new Map<PlanKey, number>();
  for (const p of DEMO_FEE_PLANS) {
    const [row] = await tx
      .insert(feePlans)
      .values({
        teamId: opts.teamId,
        name: p.name,
        priceMinor: p.priceMinor,
        currency: opts.currency,
        description: p.description,
      })
      .$returningId();
    planIds.set(p.key, row!.id);
  }
  for (const f of DEMO_FEES) {
    const athleteId = opts.athleteIds.get(f.athlete);
    if (!athleteId) continue;
    const paidAt = new Date(opts.today.getTime() - f.paidDaysAgo * 86_400_000);
    await tx.insert(athleteBilling).values({
      athleteId,
      teamId: opts.teamId,
      feePlanId: planIds.get(f.plan)!,
      status: f.status,
      lastPaymentAt: paidAt,
      currentPeriodEnd: new Date(addMonth(Math.floor(paidAt.getTime() / 1000)) * 1000),
    });
  }
}
