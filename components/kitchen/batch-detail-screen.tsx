import { router } from 'expo-router';
import { StyleSheet, View } from 'react-native';
import { formatPortionCode } from '../../shared/compute/portion-code';
import { useActiveProfile } from '../api/auth';
import { Button } from '../ui/button';
import { Callout } from '../ui/callout';
import { Card } from '../ui/card';
import { Screen } from '../ui/screen';
import { ErrorState, LoadingState } from '../ui/states';
import { Text } from '../ui/text';
import { formatCarb } from '../../shared/compute/units';
import { CarbUnknownCallout, Figure } from './cooked-weight-step';
import { carbUnderstated } from '../../shared/compute/batch';
import { dateWord, gramsText, localToday, shelfStatus } from './kitchen-format';
import { dayText } from '../ui/date-format';
import { useBatch, useUpdateBatch } from '../api/batches';
import { useSetPortionStatus } from '../api/portions';

const STATUS_WORD = { available: 'not eaten yet', eaten: 'eaten', discarded: 'thrown away' } as const;

/** A cooked batch: the weighing record, the batch arithmetic, its portions and their labels. */
export function BatchDetailScreen({ id }: { id: number }) {
  const { profile } = useActiveProfile();
  const batch = useBatch(profile?.id, id);
  const update = useUpdateBatch(profile?.id ?? 0, id);
  const mark = useSetPortionStatus();
  if (batch.isPending || !profile) return <LoadingState />;
  if (batch.isError) return <ErrorState error={batch.error} onRetry={batch.refetch} />;
  const b = batch.data;
  const status = shelfStatus(b.useBy, localToday(), b.storage);
  const when = dateWord(b.storage);
  const canEdit = profile.access !== 'clinician';

  return (
    <Screen
      title={b.recipeTitle}
      subtitle={`Cooked ${dayText(b.cookedOn)}${b.cookedBy ? ` by ${b.cookedBy.displayName}` : ''} · ${b.storage === 'freezer' ? 'freezer' : 'fridge'}`}
      backHref="/kitchen"
      actions={<Button label="Print labels" onPress={() => router.push(`/batches/${b.id}/labels`)} />}
    >
      {carbUnderstated(b.totals, b.incomplete, b.basis) ? <CarbUnknownCallout basis={b.basis} /> : null}
      <Card>
        <View style={styles.numbers}>
          <Figure label="Cooked weight" value={gramsText(b.cookedGrams)} />
          <Figure label="Raw ingredients" value={gramsText(b.rawGrams)} />
          <Figure label="Yield (cooked ÷ raw)" value={b.yieldFactor.toFixed(2)} />
          <Figure label="Carbohydrate per 100 g" value={formatCarb(b.carbPer100g.grams, b.unit, { withGrams: true })} />
          <Figure label="Carbohydrate in the batch" value={formatCarb(b.carbTotal.grams, b.unit, { withGrams: true })} />
        </View>
        <Text color="textMuted">
          Pot {gramsText(b.cookedGrossGrams)} − {b.potName ? `${b.potName} ` : 'empty pot '}
          {gramsText(b.potTareGrams)} = {gramsText(b.cookedGrams)}. Carbohydrate counted as {b.basis === 'available' ? 'available (fibre not counted)' : 'total (fibre counted)'}.
        </Text>
        <Text variant="label" color={status.tone === 'ok' ? 'inRange' : status.tone}>
          {status.tone === 'ok' ? '✓ ' : '! '}
          {when[0].toUpperCase() + when.slice(1)} {dayText(b.useBy)}: {status.text}
        </Text>
        <Text variant="caption" color="textMuted">
          {b.useByNote}
        </Text>
        {canEdit ? (
          <Button
            variant="secondary"
            label={b.storage === 'fridge' ? 'Move to the freezer' : 'Move to the fridge'}
            loading={update.isPending}
            onPress={() => update.mutate({ storage: b.storage === 'fridge' ? 'freezer' : 'fridge' })}
          />
        ) : null}
        {update.isSuccess ? (
          <Callout tone="caution" title="Printed labels now show an old date">
            {`Moved to the ${b.storage}: it is now ${when} ${dayText(b.useBy)}. Labels printed before show the old date.`}
            <Button variant="secondary" label="Reprint labels" onPress={() => router.push(`/batches/${b.id}/labels`)} />
          </Callout>
        ) : null}
      </Card>

      <Text variant="heading">Portions</Text>
      {mark.isError ? <Callout tone="danger">{mark.error.message}</Callout> : null}
      {b.portions.map((p) => (
        <Card key={p.code} aria-label={`Portion ${formatPortionCode(p.code)}`}>
          <View style={styles.row}>
            <Text variant="heading" style={styles.code}>
              {formatPortionCode(p.code)}
            </Text>
            <Text variant="lead" style={styles.grow}>
              {gramsText(p.netGrams)} · {formatCarb(p.carb.grams, b.unit, { withGrams: true })}
            </Text>
            <Text color="textMuted">{STATUS_WORD[p.status]}</Text>
          </View>
          {p.containerName ? <Text color="textMuted">{p.containerName}</Text> : null}
          <View style={styles.row}>
            <Button variant="quiet" label="Open" onPress={() => router.push(`/portions/${p.code}`)} />
            {p.status === 'available' && canEdit ? (
              <>
                <Button variant="secondary" label="Eaten" onPress={() => mark.mutate({ code: p.code, status: 'eaten' })} />
                <Button variant="danger" label="Thrown away" onPress={() => mark.mutate({ code: p.code, status: 'discarded' })} />
              </>
            ) : canEdit ? (
              <Button variant="secondary" label="Undo: not eaten yet" onPress={() => mark.mutate({ code: p.code, status: 'available' })} />
            ) : null}
          </View>
        </Card>
      ))}
      {b.splitMode === 'weighed' && b.gramsLeft > 0.5 ? (
        <Text color="textMuted">{gramsText(b.gramsLeft)} of the batch was not put into containers (left in the pot or on the spoon).</Text>
      ) : null}

      <Text variant="heading">What was weighed</Text>
      <Card>
        {b.ingredients.map((l) => (
          <View key={l.position} style={styles.row}>
            <Text style={styles.grow}>
              {l.foodName}
              {l.swappedFrom ? ` (in place of ${l.swappedFrom.foodName})` : ''}
            </Text>
            <Text color="textMuted">
              {l.omitted
                ? 'left out'
                : `${gramsText(l.actualGrams ?? 0)} (planned ${gramsText(l.plannedGrams)}) · ${formatCarb(l.carb.grams, b.unit, { withGrams: true })}`}
            </Text>
          </View>
        ))}
      </Card>
    </Screen>
  );
}

const styles = StyleSheet.create({
  numbers: { flexDirection: 'row', flexWrap: 'wrap', gap: 20 },
  row: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', gap: 8 },
  grow: { flex: 1, minWidth: 160 },
  code: { fontVariant: ['tabular-nums'], letterSpacing: 1 },
});
