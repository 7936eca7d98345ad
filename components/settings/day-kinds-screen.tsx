import { Link } from 'expo-router';
import { StyleSheet, View } from 'react-native';
import type { DayKind } from '../../shared/schemas/profile-settings';
import { useActiveProfile, useProfileCan } from '../api/auth';
import { useDayKinds } from '../api/profile-settings';
import { useLayout, useTheme } from '../theme/use-theme';
import { Button } from '../ui/button';
import { Card } from '../ui/card';
import { Screen } from '../ui/screen';
import { EmptyState, ErrorState, LoadingState } from '../ui/states';
import { Text } from '../ui/text';

const unitWord = (u: DayKind['glucoseUnit']) => (u === 'mmol_l' ? 'mmol/L' : 'mg/dL');
const cf = (k: DayKind, v: number) => (k.glucoseUnit === 'mmol_l' ? v.toFixed(1) : String(Math.round(v)));

function TimesOfDayTable({ kind }: { kind: DayKind }) {
  const t = useTheme();
  const cell = [styles.cell, { borderColor: t.colors.border }];
  return (
    <View role="table" aria-label={`${kind.name} ratios`}>
      <View role="row" style={styles.row}>
        {['Time of day', 'Insulin-to-carb ratio', 'Correction factor'].map((h) => (
          <View key={h} role="columnheader" style={cell}>
            <Text variant="label" color="textMuted">
              {h}
            </Text>
          </View>
        ))}
      </View>
      {kind.timesOfDay.map((b) => (
        <View key={b.from} role="row" style={styles.row}>
          <View role="cell" style={cell}>
            <Text>
              {b.from}–{b.to}
            </Text>
          </View>
          <View role="cell" style={cell}>
            <Text>1 unit per {b.carbRatio} g</Text>
          </View>
          <View role="cell" style={cell}>
            <Text>
              1 unit lowers {cf(kind, b.correctionFactor)} {unitWord(kind.glucoseUnit)}
            </Text>
          </View>
        </View>
      ))}
    </View>
  );
}

function TimesOfDayList({ kind }: { kind: DayKind }) {
  return (
    <View style={styles.list}>
      {kind.timesOfDay.map((b) => (
        <View key={b.from} style={styles.item}>
          <Text weight="bold">
            {b.from}–{b.to}
          </Text>
          <Text>1 unit per {b.carbRatio} g carbohydrate</Text>
          <Text color="textMuted">
            1 unit lowers glucose by {cf(kind, b.correctionFactor)} {unitWord(kind.glucoseUnit)}
          </Text>
        </View>
      ))}
    </View>
  );
}

/** Settings → day kinds: a table at wide width, a list on a phone. */
export function DayKindsScreen() {
  const { profile } = useActiveProfile();
  const kinds = useDayKinds(profile?.id);
  const { isWide } = useLayout();
  // A clinician reads these; only a grant that may change ratios gets the buttons (the server refuses the rest).
  const canEdit = useProfileCan('ratios.write');
  if (!profile || kinds.isPending) return <LoadingState />;
  if (kinds.isError) return <ErrorState error={kinds.error} onRetry={() => void kinds.refetch()} />;
  const add = canEdit ? (
    <Link href="/settings/day-kinds/new" asChild>
      <Button label="Add a day kind" />
    </Link>
  ) : undefined;
  return (
    <Screen title="Day kinds and ratios" subtitle={`For ${profile.displayName}`} backHref="/settings" actions={kinds.data.length ? add : undefined}>
      {kinds.data.length === 0 ? (
        <EmptyState title="No day kinds yet" action={add}>
          A day kind is a kind of day with its own ratios, such as a rest day and a training day.{' '}
          {canEdit ? 'Add the first one with the ratios from your diabetes team; it becomes the default.' : 'The owner has not set any yet.'}
        </EmptyState>
      ) : (
        kinds.data.map((k) => (
          <Card key={k.id} aria-label={k.name}>
            <View style={styles.head}>
              <Text variant="heading">{k.name}</Text>
              {k.isDefault ? (
                <Text variant="label" color="inRange">
                  ✓ Default
                </Text>
              ) : null}
            </View>
            <Text color="textMuted">
              Planned long-acting dose:{' '}
              {k.longActingUnits == null ? 'not recorded' : `${k.longActingUnits} units (as prescribed; recorded, never suggested)`}
            </Text>
            {isWide ? <TimesOfDayTable kind={k} /> : <TimesOfDayList kind={k} />}
            {canEdit ? (
              <View style={styles.actions}>
                <Link href={{ pathname: '/settings/day-kinds/[id]', params: { id: String(k.id) } }} asChild>
                  <Button variant="secondary" label={`Edit ${k.name}`} />
                </Link>
              </View>
            ) : null}
          </Card>
        ))
      )}
    </Screen>
  );
}

const styles = StyleSheet.create({
  head: { flexDirection: 'row', alignItems: 'center', gap: 12, flexWrap: 'wrap' },
  row: { flexDirection: 'row' },
  cell: { flex: 1, paddingVertical: 8, paddingHorizontal: 10, borderBottomWidth: 1 },
  list: { gap: 10 },
  item: { gap: 2 },
  actions: { flexDirection: 'row', gap: 12 },
});
