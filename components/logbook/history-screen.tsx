import { Link } from 'expo-router';
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import type { LogFilterFormValues } from '../../shared/schemas/logbook-read';
import { useActiveProfile, useProfileCan } from '../api/auth';
import { downloadLogExport, useLogCharts, useLogHistory } from '../api/logbook';
import { useDayKinds } from '../api/profile-settings';
import { useLayout } from '../theme/use-theme';
import { Button } from '../ui/button';
import { EmptyState, ErrorState, LoadingState } from '../ui/states';
import { Screen } from '../ui/screen';
import { Text } from '../ui/text';
import { HistoryFilters } from './history-filters';
import { HistoryCards, HistoryTable } from './history-list';
import { LazyLogChartsPanel } from './log-charts-lazy';
import { defaultPeriod } from './log-format';
import { canSaveFile, saveFile } from '../ui/save-file';

/** History: the logbook filtered by period, day kind and entry type, with the period's charts beside it. */
export function HistoryScreen() {
  const { profile } = useActiveProfile();
  const { isWide } = useLayout();
  const canWrite = useProfileCan('log.write');
  const [filters, setFilters] = useState<LogFilterFormValues>(() => ({ ...defaultPeriod(), dayKindId: '', kind: '' }));
  const [sort, setSort] = useState<'newest' | 'oldest'>('newest');
  const [exportError, setExportError] = useState<string | null>(null);
  const kinds = useDayKinds(profile?.id);
  const period = { from: filters.from, to: filters.to };
  const history = useLogHistory(profile?.id, {
    ...period,
    dayKindId: filters.dayKindId ? Number(filters.dayKindId) : undefined,
    kinds: filters.kind || undefined,
    sort,
  });
  const charts = useLogCharts(profile?.id, period);
  const rows = history.data?.pages.flatMap((p) => p.entries) ?? [];
  const units = history.data?.pages[0];

  const onExport = async () => {
    setExportError(null);
    try {
      const { blob, filename } = await downloadLogExport(profile!.id, period);
      saveFile(blob, filename);
    } catch (e) {
      setExportError((e as Error).message);
    }
  };

  const list = history.isPending ? (
    <LoadingState />
  ) : history.isError ? (
    <ErrorState error={history.error} onRetry={() => void history.refetch()} />
  ) : rows.length === 0 || !units ? (
    <EmptyState title="Nothing logged in this period">Meals, readings and doses you log appear here.</EmptyState>
  ) : (
    <>
      {isWide ? <HistoryTable profileId={profile!.id} rows={rows} units={units} /> : <HistoryCards profileId={profile!.id} rows={rows} units={units} />}
      {history.hasNextPage ? (
        <Button variant="secondary" label="Load more" loading={history.isFetchingNextPage} onPress={() => void history.fetchNextPage()} />
      ) : null}
    </>
  );
  const chartPanel = charts.isPending ? (
    <LoadingState label="Loading charts…" />
  ) : charts.isError ? (
    <ErrorState error={charts.error} onRetry={() => void charts.refetch()} />
  ) : (
    <LazyLogChartsPanel data={charts.data} />
  );

  return (
    <Screen title="Logbook" subtitle="What was eaten, read and injected. Days follow the profile's time zone." backHref="/">
      <View style={styles.links}>
        {canWrite ? (
          <Link href="/logbook/add" asChild>
            <Button label="Add an entry" />
          </Link>
        ) : null}
        <Link href={{ pathname: '/logbook/review', params: period }} asChild>
          <Button variant="secondary" label="Ratio review" />
        </Link>
        <Link href={{ pathname: '/logbook/print', params: period }} asChild>
          <Button variant="secondary" label="Review sheet to print" />
        </Link>
        {canWrite ? (
          <Link href="/logbook/import" asChild>
            <Button variant="secondary" label="Import readings" />
          </Link>
        ) : null}
        {canSaveFile && profile ? <Button variant="secondary" label="Export CSV" onPress={() => void onExport()} /> : null}
      </View>
      {exportError ? <Text color="danger">{exportError}</Text> : null}
      <HistoryFilters values={filters} dayKinds={kinds.data ?? []} onApply={setFilters} />
      <View style={[styles.columns, isWide && styles.columnsWide]}>
        <View style={[styles.column, isWide && styles.main]}>
          <View style={styles.sortRow}>
            <Text variant="heading">History</Text>
            <Button
              variant="quiet"
              label={sort === 'newest' ? 'Newest first ↓' : 'Oldest first ↑'}
              aria-label={`Sorted ${sort} first; change the order`}
              onPress={() => setSort(sort === 'newest' ? 'oldest' : 'newest')}
            />
          </View>
          {list}
        </View>
        <View style={[styles.column, isWide && styles.side]} aria-label="Charts">
          {chartPanel}
        </View>
      </View>
    </Screen>
  );
}

const styles = StyleSheet.create({
  links: { flexDirection: 'row', flexWrap: 'wrap', gap: 8 },
  columns: { gap: 16 },
  columnsWide: { flexDirection: 'row', alignItems: 'flex-start' },
  column: { gap: 12, minWidth: 0 },
  main: { flex: 3 },
  side: { flex: 2 },
  sortRow: { flexDirection: 'row', justifyContent: 'space-between', alignItems: 'center' },
});
