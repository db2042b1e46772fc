// Fee plans: prices turned into the team currency's minor units, one active plan per name, edits
// guarded by the version read, and deletion only for plans nobody has used (the rest are archived).
import {
  currencyDigits,
  toMinorUnits,
  type AthleteFee,
  type FeePlan,
  type FeePlanList,
  type FeePlanValues,
  type ListResponse,
} from '../../../shared/schemas';
import type { Queryable } from '../../db/client';
import { AppError, ConflictError, NotFoundError, ValidationError } from '../../lib/errors';
import * as repo from './fees.repository';

export function toFeePlan(r: repo.PlanRow): FeePlan {
  return {
    id: r.id,
    name: r.name,
    priceMinor: r.priceMinor,
    currency: r.currency,
    description: r.description,
    archived: r.archivedAt !== null,
    subscribers: r.subscribers,
    inUse: r.inUse,
    version: r.version,
    createdAt: r.createdAt.toISOString(),
  };
}

export function toAthleteFee(r: repo.AthleteFeeRow): AthleteFee {
  return {
    athleteId: r.athleteId,
    name: r.name,
    status: r.status,
    plan:
      r.planId !== null
        ? {
            id: r.planId,
            name: r.planName ?? '',
            priceMinor: r.planPriceMinor ?? 0,
            currency: r.planCurrency ?? '',
            archived: r.planArchivedAt !== null,
          }
        : null,
    currentPeriodEnd: r.currentPeriodEnd?.toISOString() ?? null,
    lastPaymentAt: r.lastPaymentAt?.toISOString() ?? null,
  };
}

export async function listPlans(db: Queryable, teamId: number, f: repo.PlanFilters): Promise<FeePlanList> {
  const [{ rows, total }, team] = await Promise.all([repo.listPlans(db, teamId, f), repo.teamCurrency(db, teamId)]);
  return { items: rows.map(toFeePlan), total, currency: team.currency };
}

export async function listAthleteFees(
  db: Queryable,
  teamId: number,
  f: repo.AthleteFilters,
): Promise<ListResponse<AthleteFee>> {
  const { rows, total } = await repo.listAthleteFees(db, teamId, f);
  return { items: rows.map(toAthleteFee), total };
}

async function priceInMinor(
  db: Queryable,
  teamId: number,
  price: string,
): Promise<{ minor: number; currency: string }> {
  const { currency } = await repo.teamCurrency(db, teamId);
  const minor = toMinorUnits(price, currency);
  if (minor === null || minor <= 0) {
    const digits = currencyDigits(currency);
    throw new ValidationError('Some fields need attention.', {
      price: [digits === 0 ? `${currency} has no decimals: enter a whole amount` : `Use at most ${digits} decimals`],
    });
  }
  return { minor, currency };
}

async function refuseTakenName(db: Queryable, teamId: number, name: string, exceptId?: number) {
  if (await repo.planNameTaken(db, teamId, name, exceptId)) {
    throw new ValidationError('Some fields need attention.', { name: ['Another plan already has this name'] });
  }
}

async function mustFind(db: Queryable, teamId: number, id: number) {
  const row = await repo.findPlan(db, teamId, id);
  if (!row) throw new NotFoundError('That fee plan');
  return row;
}

/** The write lost to someone else's: 404 if the plan is gone, otherwise 409 with what they saved. */
async function staleWrite(db: Queryable, teamId: number, id: number): Promise<never> {
  const current = await mustFind(db, teamId, id);
  throw new ConflictError(
    'Someone changed this plan in the meantime. Check their version and try again.',
    toFeePlan(current),
  );
}

export async function createPlan(db: Queryable, teamId: number, v: FeePlanValues): Promise<FeePlan> {
  const { minor, currency } = await priceInMinor(db, teamId, v.price);
  await refuseTakenName(db, teamId, v.name);
  const id = await repo.insertPlan(db, teamId, {
    name: v.name,
    priceMinor: minor,
    currency,
    description: v.description,
  });
  return toFeePlan(await mustFind(db, teamId, id));
}

export async function updatePlan(
  db: Queryable,
  teamId: number,
  id: number,
  v: FeePlanValues & { version: number },
): Promise<FeePlan> {
  const before = await mustFind(db, teamId, id);
  const { minor } = await priceInMinor(db, teamId, v.price);
  await refuseTakenName(db, teamId, v.name, id);
  // Athletes already paying keep the price they signed up for; a new name or price applies to new checkouts.
  const changesPrice = minor !== before.priceMinor || v.name !== before.name;
  const ok = await repo.updatePlan(
    db,
    teamId,
    id,
    v.version,
    { name: v.name, priceMinor: minor, description: v.description },
    { dropProviderPrice: changesPrice },
  );
  if (!ok) await staleWrite(db, teamId, id);
  return toFeePlan(await mustFind(db, teamId, id));
}

export async function setArchived(
  db: Queryable,
  teamId: number,
  id: number,
  version: number,
  archived: boolean,
): Promise<FeePlan> {
  const before = await mustFind(db, teamId, id);
  if (!archived) await refuseTakenName(db, teamId, before.name, id);
  const ok = await repo.updatePlan(db, teamId, id, version, { archivedAt: archived ? new Date() : null });
  if (!ok) await staleWrite(db, teamId, id);
  return toFeePlan(await mustFind(db, teamId, id));
}

function planInUse(row: repo.PlanRow): AppError {
  return new AppError(
    409,
    'plan_in_use',
    'Athletes have used this plan: archive it instead, so their history keeps it.',
    {
      current: toFeePlan(row),
    },
  );
}

export async function deletePlan(db: Queryable, teamId: number, id: number, version: number): Promise<void> {
  const row = await mustFind(db, teamId, id);
  if (row.version !== version) await staleWrite(db, teamId, id);
  if (row.inUse) throw planInUse(row);
  if (await repo.deletePlan(db, teamId, id, version)) return;
  // A checkout may have started on it a moment ago.
  const now = await mustFind(db, teamId, id);
  if (now.inUse) throw planInUse(now);
  await staleWrite(db, teamId, id);
}

// Offered to payments and webhooks: the same reads and writes, through this module's service.
export { findAthleteFee, findPlan, setPlanProviderIds, teamCurrency } from './fees.repository';
