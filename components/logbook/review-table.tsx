import { StyleSheet, View } from 'react-native';
import { formatCarb } from '../../shared/compute/units';
import type { LogReview } from '../../shared/schemas/logbook-read';
import type { CarbUnit } from '../../shared/schemas/units';
import { useLayout, useTheme } from '../theme/use-theme';
import { Text } from '../ui/text';
import { glucoseChangeText, minutesRange, unitsText } from './log-format';

/**
 * The review's figures, one row per day kind and time of day: meals behind the figure, average change from before to
 * 2–4 h after, average carbohydrate and dose. A figure with too few meals says so in words.
 */
export function ReviewTable({ review, carbUnit }: { review: LogReview; carbUnit: CarbUnit }) {
  const t = useTheme();
  const { isWide } = useLayout();
  if (!isWide) return <ReviewList review={review} carbUnit={carbUnit} />;
  return (
    <View role="table" aria-label="Ratio review">
      <View role="row" style={[styles.tr, styles.head, { borderColor: t.colors.border }]}>
        {['Day kind', 'Time of day', 'Meals', 'Average change', 'Average carbohydrate', 'Average dose'].map((h) => (
          <Text key={h} role="columnheader" variant="label" style={styles.cell}>
            {h}
          </Text>
        ))}
      </View>
      {review.groups.map((g) => (
        <View key={`${g.dayKindId}-${g.startMinute}`} role="row" style={[styles.tr, { borderColor: t.colors.border }]}>
          <Text role="cell" style={styles.cell} weight="bold">
            {g.dayKindName ?? 'No day kind'}
          </Text>
          <Text role="cell" style={styles.cell}>
            {minutesRange(g.startMinute, g.endMinute)}
          </Text>
          <Text role="cell" style={styles.cell} color={g.tooFew ? 'caution' : 'text'}>
            {g.meals}
            {g.tooFew ? ` · too few (under ${review.minimumMeals})` : ''}
          </Text>
          <Text role="cell" style={styles.cell}>
            {glucoseChangeText(g.averageChangeMmol, review.glucoseUnit)}
          </Text>
          <Text role="cell" style={styles.cell}>
            {g.averageCarbG == null ? '—' : formatCarb(g.averageCarbG, carbUnit)}
          </Text>
          <Text role="cell" style={styles.cell}>
            {unitsText(g.averageUnits)}
          </Text>
        </View>
      ))}
    </View>
  );
}

/** The same figures on a phone: one block per day kind and time of day, each figure on its own line. */
function ReviewList({ review, carbUnit }: { review: LogReview; carbUnit: CarbUnit }) {
  const t = useTheme();
  return (
    <View role="list" aria-label="Ratio review">
      {review.groups.map((g) => (
        <View key={`${g.dayKindId}-${g.startMinute}`} role="listitem" style={[styles.item, { borderColor: t.colors.border }]}>
          <Text weight="bold">
            {g.dayKindName ?? 'No day kind'} · {minutesRange(g.startMinute, g.endMinute)}
          </Text>
          <Text color={g.tooFew ? 'caution' : 'text'}>
            Meals: {g.meals}
            {g.tooFew ? ` · too few (under ${review.minimumMeals})` : ''}
          </Text>
          <Text>Average change: {glucoseChangeText(g.averageChangeMmol, review.glucoseUnit)}</Text>
          <Text>Average carbohydrate: {g.averageCarbG == null ? '—' : formatCarb(g.averageCarbG, carbUnit)}</Text>
          <Text>Average dose: {unitsText(g.averageUnits)}</Text>
        </View>
      ))}
    </View>
  );
}

const styles = StyleSheet.create({
  item: { borderBottomWidth: 1, paddingVertical: 8, gap: 2 },
  tr: { flexDirection: 'row', borderBottomWidth: 1, paddingVertical: 6, gap: 6 },
  head: { borderBottomWidth: 2 },
  cell: { flex: 1, paddingHorizontal: 2 },
});
