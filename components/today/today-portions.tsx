import { Link } from 'expo-router';
import { StyleSheet, View } from 'react-native';
import { formatPortionCode } from '../../shared/compute/portion-code';
import { formatCarb } from '../../shared/compute/units';
import type { BatchSummary } from '../../shared/schemas/batch';
import type { CarbUnit } from '../../shared/schemas/units';
import { doseCheckHref } from '../dose/dose-href';
import { dateWord, shelfStatus } from '../kitchen/kitchen-format';
import { dayText } from '../ui/date-format';
import { useBatches } from '../api/batches';
import { useTheme } from '../theme/use-theme';
import { Button } from '../ui/button';
import { Card } from '../ui/card';
import { EmptyState, ErrorState, LoadingState } from '../ui/states';
import { Text } from '../ui/text';

/** How many portions Today lists before sending the person to the kitchen for the rest. */
const SHOWN = 8;

type Row = { code: string; title: string; storage: BatchSummary['storage']; useBy: string; carbGrams: number | null; netGrams: number };

/** Portions still available, soonest use-by first (fridge before freezer on the same date). */
export function availablePortions(batches: BatchSummary[]): Row[] {
  return batches
    .flatMap((b) =>
      b.portions
        .filter((p) => p.status === 'available')
        .map((p) => ({ code: p.code, title: b.recipeTitle, storage: b.storage, useBy: b.useBy, carbGrams: p.carb.grams, netGrams: p.netGrams })),
    )
    .sort((a, b) => a.useBy.localeCompare(b.useBy) || (a.storage === b.storage ? 0 : a.storage === 'fridge' ? -1 : 1) || a.code.localeCompare(b.code));
}

function PortionRow({ row, unit, today }: { row: Row; unit: CarbUnit; today: string }) {
  const t = useTheme();
  const shelf = shelfStatus(row.useBy, today, row.storage);
  const carb = formatCarb(row.carbGrams, unit);
  return (
    <View style={[styles.row, { borderColor: t.colors.border }]} role="listitem" aria-label={`${row.title}, portion ${formatPortionCode(row.code)}`}>
      <View style={styles.rowText}>
        <Text weight="bold">{row.title}</Text>
        <Text color="textMuted">
          {formatPortionCode(row.code)} · {row.storage === 'freezer' ? 'Freezer' : 'Fridge'} · {Math.round(row.netGrams)} g · {dateWord(row.storage)} {dayText(row.useBy)}
        </Text>
        {shelf.tone !== 'ok' ? (
          <Text variant="label" color={shelf.tone === 'danger' ? 'danger' : 'caution'}>
            ! {shelf.text}
          </Text>
        ) : null}
      </View>
      <View style={styles.rowEnd}>
        <Text variant="lead" weight="bold" style={styles.carb}>
          {carb}
        </Text>
        {row.carbGrams != null && shelf.tone !== 'danger' ? (
          <Link href={doseCheckHref({ code: row.code, carbGrams: row.carbGrams, label: row.title }, true)} asChild>
            <Button variant="secondary" label="Log this meal" aria-label={`Log this meal: ${row.title} ${formatPortionCode(row.code)}`} />
          </Link>
        ) : null}
      </View>
    </View>
  );
}

/** What is cooked and waiting in the fridge and freezer, each portion with its carbohydrate and a dose check. */
export function TodayPortionsCard({ profileId, unit, today }: { profileId: number; unit: CarbUnit; today: string }) {
  const batches = useBatches(profileId, 'available');
  if (batches.isPending) return <Card><LoadingState label="Loading the fridge and freezer…" /></Card>;
  if (batches.isError && !batches.data) return <Card><ErrorState error={batches.error} onRetry={() => void batches.refetch()} /></Card>;
  const rows = availablePortions(batches.data);
  if (rows.length === 0) {
    return (
      <EmptyState
        title="Nothing cooked in the fridge or freezer"
        action={
          <Link href="/kitchen" asChild>
            <Button variant="secondary" label="Go to the kitchen" />
          </Link>
        }
      >
        When you cook and portion a batch, each portion shows here with its carbohydrate, ready for a dose check.
      </EmptyState>
    );
  }
  return (
    <Card aria-label="In the fridge and freezer">
      <Text variant="heading">In the fridge and freezer</Text>
      <Text color="textMuted">
        {rows.length} portion{rows.length === 1 ? '' : 's'} left, soonest use-by first. Carbohydrate as weighed when cooked.
      </Text>
      <View role="list">
        {rows.slice(0, SHOWN).map((r) => (
          <PortionRow key={r.code} row={r} unit={unit} today={today} />
        ))}
      </View>
      {rows.length > SHOWN ? (
        <Link href="/kitchen" asChild>
          <Button variant="quiet" label={`See all ${rows.length} in the kitchen`} />
        </Link>
      ) : null}
    </Card>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', alignItems: 'center', gap: 12, paddingVertical: 10, borderBottomWidth: 1 },
  rowText: { flex: 1, minWidth: 0, gap: 2 },
  rowEnd: { alignItems: 'flex-end', gap: 6 },
  carb: { fontVariant: ['tabular-nums'] },
});
