// Saves board changes (one cell or several at once), showing them at once and putting the snapshot
// back if the server refuses; the caller decides what a conflict or a rule break leads to.
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import {
  cellStatusChangeSchema,
  type BoardData,
  type CellStatusChange,
  type ListResponse,
  type PlanEntryDto,
} from '../../../../shared/schemas';
import { api } from '../../../lib/api-client';
import { applyEntries, applyOptimistic, requestFor, type CellChange } from '../model/changes';
import { planKeys } from './queries';

export interface SaveVars {
  changes: CellChange[];
}

export interface SaveResult {
  saved: PlanEntryDto[];
  /** Other cells whose status the save changed. */
  affected: CellStatusChange[];
}

const affectedSchema = z.array(cellStatusChangeSchema).catch([]);

async function send(changes: CellChange[]): Promise<SaveResult> {
  const r = requestFor(changes);
  if (r.method === 'DELETE') return { saved: [await api<PlanEntryDto>(r.path, { method: 'DELETE' })], affected: [] };
  if (r.method === 'PUT') {
    const { affected, ...entry } = await api<PlanEntryDto & { affected?: unknown }>(r.path, {
      method: 'PUT',
      body: r.body,
    });
    return { saved: [entry], affected: affectedSchema.parse(affected ?? []) };
  }
  const res = await api<ListResponse<PlanEntryDto> & { affected?: unknown }>(r.path, { method: 'POST', body: r.body });
  return { saved: res.items, affected: affectedSchema.parse(res.affected ?? []) };
}

export function useSavePlanEntries() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (vars: SaveVars) => send(vars.changes),
    onMutate: async (vars) => {
      await queryClient.cancelQueries({ queryKey: planKeys.boards() });
      const snapshots = queryClient.getQueriesData<BoardData>({ queryKey: planKeys.boards() });
      queryClient.setQueriesData<BoardData>({ queryKey: planKeys.boards() }, (d) =>
        d ? applyOptimistic(d, vars.changes) : d,
      );
      return { snapshots };
    },
    onError: (_err, _vars, context) => {
      for (const [key, data] of context?.snapshots ?? []) queryClient.setQueryData(key, data);
    },
    onSuccess: ({ saved }) => {
      queryClient.setQueriesData<BoardData>({ queryKey: planKeys.boards() }, (d) => (d ? applyEntries(d, saved) : d));
    },
    onSettled: async (_data, _err, vars) => {
      await Promise.all([...vars.changes.map((c) => queryClient.invalidateQueries({ queryKey: planKeys.history(c) }))]);
    },
  });
}
