import { keepPreviousData, useInfiniteQuery, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { CreateLogEntryInput, EditLogEntryInput, LogEntry, LogEntryChange, LogGroup, LogMealInput } from '../../shared/schemas/logbook';
import { batchKeys } from './batches';
import { apiFetch, apiFetchBlob, queryString } from './client';
import { portionKeys } from './portions';
import type { LogCharts, LogHistoryFilters, LogHistoryPage, LogPeriodQuery, LogReview, ReadingsImportColumns, ReadingsImportPreview, ReadingsImportResult } from '../../shared/schemas/logbook-read';

/** Every logbook query of a profile sits under one key, so a new entry or an import refreshes them all. */
export const logbookKeys = {
  all: ['logbook'] as const,
  profile: (profileId: number) => [...logbookKeys.all, profileId] as const,
  recent: (profileId: number) => [...logbookKeys.profile(profileId), 'recent'] as const,
};
// ---- Logbook: logging a meal, recent entries, undo (the breakfast flow) ----

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

/** Logs one entry of any kind (a reading, a dose, exercise, typed carbohydrate). */
export function useCreateLogEntry(profileId: number) {
  const changed = useAfterLogChange();
  return useMutation({
    mutationFn: (input: CreateLogEntryInput) => apiFetch<LogGroup>(`/profiles/${profileId}/log-entries`, { method: 'POST', body: input }),
    onSuccess: changed,
  });
}

/** Corrects an entry; the server keeps the version before in its changes. */
export function useUpdateLogEntry(profileId: number) {
  const changed = useAfterLogChange();
  return useMutation({
    mutationFn: ({ id, input }: { id: number; input: EditLogEntryInput }) =>
      apiFetch<LogEntry>(`/profiles/${profileId}/log-entries/${id}`, { method: 'PATCH', body: input }),
    onSuccess: changed,
  });
}

/** Deletes an entry (kept as deleted, with its history). */
export function useDeleteLogEntry(profileId: number) {
  const changed = useAfterLogChange();
  return useMutation({
    mutationFn: (id: number) => apiFetch<LogEntry>(`/profiles/${profileId}/log-entries/${id}`, { method: 'DELETE' }),
    onSuccess: changed,
  });
}

/** An entry's corrections, oldest first: who, when, before → after (used only where they are shown on demand). */
export function useLogEntryChanges(profileId: number, entryId: number) {
  return useQuery({
    queryKey: [...logbookKeys.profile(profileId), 'changes', entryId],
    queryFn: () => apiFetch<LogEntryChange[]>(`/profiles/${profileId}/log-entries/${entryId}/changes`),
  });
}

// ---- end of the breakfast-flow block ----

// ---------------------------------------------------------------------------------------------------------------
// Reading the logbook: history, charts, the ratio review, export and the readings import.
// ---------------------------------------------------------------------------------------------------------------

export const logReadKeys = {
  history: (profileId: number, filters: LogHistoryFilters) => [...logbookKeys.profile(profileId), 'history', filters] as const,
  charts: (profileId: number, period: LogPeriodQuery) => [...logbookKeys.profile(profileId), 'charts', period] as const,
  review: (profileId: number, period: LogPeriodQuery) => [...logbookKeys.profile(profileId), 'review', period] as const,
};

const historyPath = (profileId: number, filters: LogHistoryFilters, cursor: string | null) =>
  `/profiles/${profileId}/logbook/history${queryString({
    from: filters.from,
    to: filters.to,
    dayKindId: filters.dayKindId,
    kinds: filters.kinds,
    sort: filters.sort,
    limit: filters.limit,
    cursor,
  })}`;

/** The logbook page by page ("Load more" follows the cursor), filtered by dates, day kind and entry type. */
export function useLogHistory(profileId: number | undefined, filters: LogHistoryFilters) {
  return useInfiniteQuery({
    queryKey: logReadKeys.history(profileId ?? 0, filters),
    queryFn: ({ pageParam }) => apiFetch<LogHistoryPage>(historyPath(profileId!, filters, pageParam)),
    initialPageParam: null as string | null,
    getNextPageParam: (last) => last.nextCursor,
    placeholderData: keepPreviousData,
    enabled: !!profileId,
  });
}

/** Chart data for a period: per-day carbohydrate and insulin, glucose before meals, time in range. */
export function useLogCharts(profileId: number | undefined, period: LogPeriodQuery) {
  return useQuery({
    queryKey: logReadKeys.charts(profileId ?? 0, period),
    queryFn: () => apiFetch<LogCharts>(`/profiles/${profileId}/logbook/charts${queryString(period)}`),
    placeholderData: keepPreviousData,
    enabled: !!profileId,
  });
}

/** The ratio review for a period (evidence only, with its caution). */
export function useRatioReview(profileId: number | undefined, period: LogPeriodQuery) {
  return useQuery({
    queryKey: logReadKeys.review(profileId ?? 0, period),
    queryFn: () => apiFetch<LogReview>(`/profiles/${profileId}/logbook/review${queryString(period)}`),
    placeholderData: keepPreviousData,
    enabled: !!profileId,
  });
}

/** The address of the CSV export (for a link) and a fetch of it behind the bearer token (for a download). */
export const logExportPath = (profileId: number, period: LogPeriodQuery) => `/profiles/${profileId}/logbook/export.csv${queryString(period)}`;
export async function downloadLogExport(profileId: number, period: LogPeriodQuery): Promise<{ blob: Blob; filename: string }> {
  const blob = await apiFetchBlob(logExportPath(profileId, period), { headers: { Accept: 'text/csv' } });
  return { blob, filename: `logbook-${period.from}-to-${period.to}.csv` };
}

function importForm(file: Blob & { name?: string }, mapping: Partial<ReadingsImportColumns>) {
  const form = new FormData();
  for (const [k, v] of Object.entries(mapping)) if (v != null && v !== '') form.append(k, String(v));
  form.append('file', file, file.name ?? 'readings.csv');
  return form;
}

/** Step 2 of the readings import: what the file holds and the first rows as they would be stored. */
export function useReadingsImportPreview(profileId: number | undefined) {
  return useMutation({
    mutationFn: ({ file, mapping }: { file: Blob & { name?: string }; mapping: Partial<ReadingsImportColumns> }) =>
      apiFetch<ReadingsImportPreview>(`/profiles/${profileId}/logbook/readings-import/preview`, { method: 'POST', body: importForm(file, mapping) }),
  });
}

/** Step 3: imports every reading of the file in one go (or none); refreshes the logbook. */
export function useReadingsImport(profileId: number | undefined) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ file, mapping }: { file: Blob & { name?: string }; mapping: ReadingsImportColumns }) =>
      apiFetch<ReadingsImportResult>(`/profiles/${profileId}/logbook/readings-import`, { method: 'POST', body: importForm(file, mapping) }),
    onSuccess: () => qc.invalidateQueries({ queryKey: logbookKeys.profile(profileId ?? 0) }),
  });
}
