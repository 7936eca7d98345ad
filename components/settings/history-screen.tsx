import { StyleSheet, View } from 'react-native';
import type { SettingsChange } from '../../shared/schemas/profile-settings';
import { useActiveProfile } from '../api/auth';
import { useSettingsHistory } from '../api/profile-settings';
import { Card } from '../ui/card';
import { dateTimeText } from '../ui/date-format';
import { Screen } from '../ui/screen';
import { EmptyState, ErrorState, LoadingState } from '../ui/states';
import { Text } from '../ui/text';

const WORDS: Record<string, string> = {
  carbRatio: 'ratio (g per unit)',
  correctionFactor: 'correction factor',
  from: 'from',
  to: 'to',
  name: 'name',
  isDefault: 'default',
  longActingUnits: 'planned long-acting dose',
  glucoseUnit: 'glucose unit',
  carbBasis: 'carbohydrate basis',
  carbUnit: 'carbohydrate unit',
  preferredFoodTable: 'food table shown first',
  timeZone: 'time zone',
  penIncrement: 'pen step',
  rounding: 'rounding',
  maxDoseUnits: 'largest single dose',
  actionTimeHours: 'action time (hours)',
  activeInsulinModel: 'active insulin model',
  targetLow: 'target range from',
  targetHigh: 'target range to',
  correctionTarget: 'correct to',
  hypoThreshold: 'low threshold',
  veryHigh: 'very-high threshold',
  allowNegativeCorrection: 'negative correction',
  iobConvention: 'active insulin taken off',
  exerciseReductions: 'exercise',
  min30: 'about 30 min (%)',
  min60: 'about 60 min (%)',
};

/** "timesOfDay.0.carbRatio" → "time of day 1 ratio (g per unit)". */
export function fieldWords(path: string): string {
  return path
    .split('.')
    .filter((p) => p !== 'settings')
    .map((p, i, all) => (/^\d+$/.test(p) && all[i - 1] === 'timesOfDay' ? String(Number(p) + 1) : (WORDS[p] ?? p)))
    .join(' ')
    .replace(/^timesOfDay /, 'time of day ');
}

const VALUE_WORDS: Record<string, string> = {
  mmol_l: 'mmol/L',
  mg_dl: 'mg/dL',
  correction_only: 'the correction only',
  portion10: '10 g portions',
  unit12: '12 g units',
  exchange15: '15 g exchanges',
};
const shown = (v: unknown) =>
  v == null || v === '' ? '—' : typeof v === 'boolean' ? (v ? 'yes' : 'no') : typeof v === 'string' ? (VALUE_WORDS[v] ?? v) : String(v);
const ACTION = { created: 'set up', updated: 'changed', deleted: 'deleted' } as const;

function ChangeCard({ change }: { change: SettingsChange }) {
  const when = dateTimeText(change.createdAt);
  return (
    <Card>
      <Text weight="bold">
        {change.changedBy.displayName} {ACTION[change.action]} {change.subject === 'day_kind' ? `day kind “${change.subjectName}”` : change.subjectName.toLowerCase()}
      </Text>
      <Text variant="caption" color="textMuted">
        {when}
      </Text>
      <View style={styles.list}>
        {change.changes.slice(0, 40).map((c) => (
          <Text key={c.field}>
            {fieldWords(c.field)}: {shown(c.from)} → {shown(c.to)}
          </Text>
        ))}
        {change.changes.length > 40 ? <Text color="textMuted">and {change.changes.length - 40} more</Text> : null}
      </View>
    </Card>
  );
}

/** Settings → change history, shown to everyone with access to the profile. */
export function HistoryScreen() {
  const { profile } = useActiveProfile();
  const history = useSettingsHistory(profile?.id);
  if (!profile || history.isPending) return <LoadingState />;
  if (history.isError) return <ErrorState error={history.error} onRetry={() => void history.refetch()} />;
  return (
    <Screen title="Change history" subtitle={`For ${profile.displayName}`} backHref="/settings">
      {history.data.length === 0 ? (
        <EmptyState title="No changes yet">Every change to units, limits and day kinds will be listed here with who made it and when.</EmptyState>
      ) : (
        history.data.map((c) => <ChangeCard key={c.id} change={c} />)
      )}
    </Screen>
  );
}

const styles = StyleSheet.create({ list: { gap: 2 } });
