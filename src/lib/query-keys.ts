// The query keys more than one feature touches: one factory per area, generic to specific, so a
// feature invalidates another area's cache through the same keys its owner reads with.

export interface RosterFilters {
  q: string;
  includeArchived: boolean;
  sort: string;
}

export interface TopSetFilter {
  athleteId?: number;
  variantId: number;
}

/** The roster: athlete lists, one athlete, their history, linkable accounts, the library's families. */
export const athleteKeys = {
  all: ['athletes'] as const,
  lists: () => [...athleteKeys.all, 'list'] as const,
  list: (f: RosterFilters) => [...athleteKeys.lists(), f] as const,
  details: () => [...athleteKeys.all, 'detail'] as const,
  detail: (id: number) => [...athleteKeys.details(), id] as const,
  histories: () => [...athleteKeys.all, 'history'] as const,
  history: (id: number) => [...athleteKeys.histories(), id] as const,
  accounts: () => [...athleteKeys.all, 'accounts'] as const,
  /** The library's families, offered by the restrictions form. */
  families: () => [...athleteKeys.all, 'families'] as const,
};

/** The athlete's history: their own records and series, and the top sets of one variant. */
export const historyKeys = {
  all: ['history'] as const,
  mine: () => [...historyKeys.all, 'mine'] as const,
  topSetLists: () => [...historyKeys.all, 'top-sets'] as const,
  topSets: (filter: TopSetFilter) => [...historyKeys.topSetLists(), filter] as const,
};

/** Who is signed in, and the account's signed-in devices. */
export const authKeys = {
  all: ['auth'] as const,
  me: () => [...authKeys.all, 'me'] as const,
  sessions: () => [...authKeys.all, 'sessions'] as const,
};
