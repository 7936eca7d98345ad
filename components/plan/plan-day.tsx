import { StyleSheet, View } from 'react-native';
import type { PlanDay } from '../../shared/schemas/plan';
import type { CarbUnit } from '../../shared/schemas/units';
import { useIsOnline } from '../api/online';
import { DOSE_NOT_SHOWN_OFFLINE } from '../offline/offline-notice';
import { useTheme } from '../theme/use-theme';
import { Button } from '../ui/button';
import { Card } from '../ui/card';
import { Text } from '../ui/text';
import { dayText } from '../ui/date-format';
import { mealCarbText, plannedDoseText, totalsText } from './plan-format';

// A printed week shows the plan, not its buttons.
const hideInPrint = { dataSet: { print: 'hide' } } as object;

const FROM_WORDS = { date: 'set for this date', pattern: 'weekly pattern', default: 'default' } as const;

/** One day of the plan: its kind, its meals with carbohydrate and planned doses, its totals. */
export function PlanDayCard({ day, unit, compact, onRemove }: { day: PlanDay; unit: CarbUnit; compact?: boolean; onRemove?: (mealId: number) => void }) {
  const t = useTheme();
  const totals = totalsText(day.totals, unit);
  const online = useIsOnline();
  // Seven columns are narrow: the totals take the smaller type so long words are not broken.
  const size = compact ? 'caption' : 'body';
  return (
    <Card aria-label={dayText(day.date)} style={compact ? styles.compact : undefined}>
      <Text variant="heading">{dayText(day.date)}</Text>
      <Text color="textMuted">{day.dayKind ? `${day.dayKind.name} (${FROM_WORDS[day.dayKind.from]})` : 'No kind of day'}</Text>
      {day.meals.length === 0 ? <Text color="textMuted">No meals planned.</Text> : null}
      {day.meals.map((m) => (
        <View key={m.id} style={[styles.meal, { borderColor: t.colors.border }]} aria-label={`${m.mealName} ${m.time}`}>
          <Text weight="bold">
            {m.mealName} · {m.time}
            {m.logged ? ' · logged' : ''}
          </Text>
          <Text>
            {m.title} — {m.detail}
          </Text>
          <Text>Carbohydrate: {mealCarbText(m, unit)}</Text>
          <Text>Planned dose: {online ? plannedDoseText(m.dose) : DOSE_NOT_SHOWN_OFFLINE}</Text>
          {m.logged?.carbGrams != null ? <Text color="textMuted">Logged: {mealCarbText({ ...m, carb: { grams: m.logged.carbGrams, inUnit: null }, plannedCarb: null }, unit)}</Text> : null}
          {onRemove && !m.logged ? (
            <View {...hideInPrint} style={styles.remove}>
              <Button variant="quiet" label={`Remove ${m.mealName.toLowerCase()}`} onPress={() => onRemove(m.id)} />
            </View>
          ) : null}
        </View>
      ))}
      <View style={styles.totals} aria-label="Day totals">
        <Text weight="bold" variant={size}>Carbohydrate {totals.carb}</Text>
        <Text variant={size}>Planned rapid-acting {online ? totals.rapid : DOSE_NOT_SHOWN_OFFLINE}</Text>
        <Text variant={size}>Long-acting {totals.long}</Text>
      </View>
    </Card>
  );
}

const styles = StyleSheet.create({
  compact: { flex: 1, minWidth: 0 },
  meal: { gap: 2, paddingVertical: 6, borderTopWidth: StyleSheet.hairlineWidth },
  remove: { alignItems: 'flex-start' },
  totals: { gap: 2, paddingTop: 8 },
});
