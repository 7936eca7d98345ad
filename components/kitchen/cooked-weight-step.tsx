import { StyleSheet, View } from 'react-native';
import type { BatchComputation } from '../../shared/compute/batch';
import type { Container } from '../../shared/schemas/container';
import type { CarbUnit } from '../../shared/schemas/units';
import { Button } from '../ui/button';
import { Callout } from '../ui/callout';
import { Card } from '../ui/card';
import { Text } from '../ui/text';
import { TextField } from '../ui/text-field';
import { ChoiceGroup } from '../ui/choice-group';
import { netOf, type Weighing } from './cook-state';
import { carbText, gramsText } from './kitchen-format';

type Props = {
  pot: Weighing;
  pots: Container[];
  onChange: (pot: Weighing) => void;
  batch: BatchComputation | null;
  unit: CarbUnit;
  errors: Record<string, string>;
  onBack: () => void;
  onDone: () => void;
};

/** The cooked weight: the pot's gross weight on the scale minus the pot's tare. */
export function CookedWeightStep({ pot, pots, onChange, batch, unit, errors, onBack, onDone }: Props) {
  const net = netOf(pot);
  return (
    <Card aria-label="Cooked weight">
      <Text variant="heading">Weigh the cooked pot</Text>
      <Text color="textMuted">Put the whole pot on the scale (without the lid unless you weighed the lid too).</Text>
      {pots.length ? (
        <ChoiceGroup
          label="Which pot"
          value={String(pot.containerId ?? 'other')}
          onChange={(v) => {
            const chosen = pots.find((p) => String(p.id) === v);
            onChange({ ...pot, containerId: chosen?.id ?? null, tare: chosen ? String(chosen.tareGrams) : pot.tare });
          }}
          choices={[...pots.map((p) => ({ value: String(p.id), label: `${p.name} (${gramsText(p.tareGrams)})` })), { value: 'other', label: 'Another pot' }]}
        />
      ) : null}
      <TextField label="Empty pot (tare)" unit="g" keyboardType="decimal-pad" value={pot.tare} onChangeText={(tare) => onChange({ ...pot, tare })} error={errors['cookedWeight.tareGrams']} />
      <TextField label="Pot with the food (gross)" unit="g" keyboardType="decimal-pad" value={pot.gross} onChangeText={(gross) => onChange({ ...pot, gross })} error={errors['cookedWeight.grossGrams']} />
      {net == null ? (
        <Callout tone="caution" title="Not yet">
          Enter the gross weight; the empty pot must weigh less than the full one.
        </Callout>
      ) : batch ? (
        <View style={styles.numbers} aria-label="Batch numbers">
          <Figure label="Cooked weight" value={gramsText(batch.cookedGrams)} />
          <Figure label="Raw ingredients" value={gramsText(batch.rawGrams)} />
          <Figure label="Yield (cooked ÷ raw)" value={batch.yieldFactor.toFixed(2)} />
          <Figure label="Carbohydrate per 100 g cooked" value={carbText(batch.carbPer100g, unit)} />
          <Figure label="Carbohydrate in the batch" value={carbText(batch.carbTotal, unit)} />
        </View>
      ) : null}
      {batch && batch.incomplete.some((k) => k === 'carbAvailable' || k === 'carbTotal') ? (
        <Callout tone="caution" title="Some values unknown">
          An ingredient has no carbohydrate value in the table, so these numbers may be too low.
        </Callout>
      ) : null}
      <View style={styles.row}>
        <Button variant="quiet" label="‹ Back to weighing" onPress={onBack} />
        <Button size="lg" label="Split into portions" disabled={!batch} onPress={onDone} />
      </View>
    </Card>
  );
}

/** A labelled big number. */
export function Figure({ label, value }: { label: string; value: string }) {
  return (
    <View style={styles.figure}>
      <Text variant="label" color="textMuted">
        {label}
      </Text>
      <Text variant="heading">{value}</Text>
    </View>
  );
}

const styles = StyleSheet.create({
  numbers: { flexDirection: 'row', flexWrap: 'wrap', gap: 20 },
  figure: { minWidth: 130, gap: 2 },
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: 8, alignItems: 'center' },
});
