import { router } from 'expo-router';
import { StyleSheet, View } from 'react-native';
import { formatPortionCode } from '../../shared/compute/portion-code';
import type { BatchSummary } from '../../shared/schemas/batch';
import { Button } from '../ui/button';
import { Callout } from '../ui/callout';
import { Card } from '../ui/card';
import { Text } from '../ui/text';
import { formatCarb } from '../../shared/compute/units';
import { dateWord, gramsText, shelfStatus } from './kitchen-format';
import { dayText } from '../ui/date-format';

/** One batch on the inventory shelf: where it is, how long it keeps, what is left. */
export function BatchCard({ batch, today }: { batch: BatchSummary; today: string }) {
  const status = shelfStatus(batch.useBy, today, batch.storage);
  const left = batch.portions.filter((p) => p.status === 'available');
  return (
    <Card aria-label={`Batch ${batch.recipeTitle}`}>
      <View style={styles.head}>
        <Text variant="heading" style={styles.title}>
          {batch.recipeTitle}
        </Text>
        <Text variant="label" color="textMuted">
          {batch.storage === 'freezer' ? 'Freezer' : 'Fridge'}
        </Text>
      </View>
      <Text color="textMuted">
        Cooked {dayText(batch.cookedOn)} · {dateWord(batch.storage)} {dayText(batch.useBy)} · {batch.counts.available} left, {batch.counts.eaten} eaten,{' '}
        {batch.counts.discarded} thrown away
      </Text>
      {left.length > 0 ? (
        status.tone === 'danger' ? (
          <Callout tone="danger" title="Past use-by">
            {`${status.text}. Food-safety advice is to throw these portions away.`}
          </Callout>
        ) : (
          <Text variant="label" color={status.tone === 'ok' ? 'inRange' : 'caution'}>
            {status.tone === 'ok' ? '✓ ' : '! '}
            {status.text}
          </Text>
        )
      ) : null}
      {left.length > 0 ? (
        <View style={styles.portions}>
          {left.map((p) => (
            <Text key={p.code} style={styles.portion}>
              {formatPortionCode(p.code)} · {gramsText(p.netGrams)} · {formatCarb(p.carb.grams, batch.unit, { withGrams: true })}
            </Text>
          ))}
        </View>
      ) : null}
      <Button variant="secondary" label="Open batch" onPress={() => router.push(`/kitchen/batches/${batch.id}`)} />
    </Card>
  );
}

const styles = StyleSheet.create({
  head: { flexDirection: 'row', justifyContent: 'space-between', alignItems: 'baseline', gap: 8 },
  title: { flexShrink: 1 },
  portions: { gap: 4 },
  portion: { fontVariant: ['tabular-nums'] },
});
