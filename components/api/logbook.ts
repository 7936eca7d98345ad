import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { LogEntry, LogGroup, LogMealInput } from '../../shared/schemas/logbook';
import { batchKeys } from './batches';
import { apiFetch } from './client';
import { portionKeys } from './portions';

// ---- Logbook: logging a meal, recent entries, undo (the breakfast flow) ----

export const logbookKeys = {
  all: ['logbook'] as const,
  recent: (profileId: number) => [...logbookKeys.all, 'recent', profileId] as const,
};

/** Saving or undoing entries changes the fridge list, portion pages, the logbook and the next dose check. */
function useAfterLogChange() {
  const qc = useQueryClient();
  return () => {
    void qc.invalidateQueries({ queryKey: logbookKeys.all });
    void qc.invalidateQueries({ queryKey: batchKeys.all });
    void qc.invalidateQueries({ queryKey: portionKeys.all });
  };
}

/** Logs a meal in one transaction: the meal, the reading, the doses taken and the portion eaten. */
export function useLogMeal(profileId: number) {
  const changed = useAfterLogChange();
  return useMutation({
    mutationFn: (input: LogMealInput) => apiFetch<LogGroup>(`/profiles/${profileId}/log-entries/meals`, { method: 'POST', body: input }),
    onSuccess: changed,
  });
}

/** Undo right after saving: reverts everything saved together, the portion's eaten state included. */
export function useUndoLogGroup(profileId: number) {
  const changed = useAfterLogChange();
  return useMutation({
    mutationFn: (groupKey: string) => apiFetch<LogGroup>(`/profiles/${profileId}/log-groups/${groupKey}/undo`, { method: 'POST' }),
    onSuccess: changed,
  });
}

/** The latest entries, newest first. */
export function useRecentLog(profileId: number | undefined, limit = 10) {
  return useQuery({
    queryKey: [...logbookKeys.recent(profileId ?? 0), limit],
    queryFn: () => apiFetch<LogEntry[]>(`/profiles/${profileId}/log-entries/recent?limit=${limit}`),
    enabled: !!profileId,
  });
}

// ---- end of the breakfast-flow block ----
