import { useWatch } from 'react-hook-form';
import { StyleSheet, View } from 'react-native';
import { carbUnderstated, type BatchComputation } from '../../shared/compute/batch';
import type { Container } from '../../shared/schemas/container';
import type { CarbBasis, CarbUnit } from '../../shared/schemas/units';
import { Button } from '../ui/button';
import { Callout } from '../ui/callout';
import { Card } from '../ui/card';
import { FormChoiceGroup } from '../ui/form-choice-group';
import { FormTextField } from '../ui/form-text-field';
import { Text } from '../ui/text';
import { formatCarb } from '../../shared/compute/units';
import type { CookForm } from './cook-batch-screen';
import { netOf } from './cook-state';
import { gramsText } from './kitchen-format';

type Props = {
  form: CookForm;
  pots: Container[];
  batch: BatchComputation | null;
  basis: CarbBasis;
  unit: CarbUnit;
  onBack: () => void;
  onDone: () => void;
};

/** Choices of saved containers ("Big pot (1450 g)") plus "another"; choosing one fills in its tare. */
export function containerChoices(containers: Container[], other: string) {
  return [...containers.map((c) => ({ value: String(c.id), label: `${c.name} (${gramsText(c.tareGrams)})` })), { value: '', label: other }];
}

/** The cooked weight: the pot's gross weight on the scale minus the pot's tare. */
export function CookedWeightStep({ form, pots, batch, basis, unit, onBack, onDone }: Props) {
  const net = netOf(useWatch({ control: form.control, name: 'pot' }));
  return (
    <Card aria-label="Cooked weight">
      <Text variant="heading">Weigh the cooked pot</Text>
      <Text color="textMuted">Put the whole pot on the scale (without the lid unless you weighed the lid too).</Text>
      {pots.length ? (
        <FormChoiceGroup
          control={form.control}
          name="pot.containerId"
          label="Which pot"
          choices={containerChoices(pots, 'Another pot')}
          onChosen={(id) => {
            const chosen = pots.find((p) => String(p.id) === id);
            if (chosen) form.setValue('pot.tare', String(chosen.tareGrams));
          }}
        />
      ) : null}
      <FormTextField control={form.control} name="pot.tare" label="Empty pot (tare)" unit="g" keyboardType="decimal-pad" />
      <FormTextField control={form.control} name="pot.gross" label="Pot with the food (gross)" unit="g" keyboardType="decimal-pad" />
      {net == null ? (
        <Callout tone="caution" title="Not yet">
          Enter the gross weight; the empty pot must weigh less than the full one.
        </Callout>
      ) : batch ? (
        <>
          {carbUnderstated(batch.totals, batch.incomplete, basis) ? <CarbUnknownCallout basis={basis} /> : null}
          <View style={styles.numbers} aria-label="Batch numbers">
            <Figure label="Cooked weight" value={gramsText(batch.cookedGrams)} />
            <Figure label="Raw ingredients" value={gramsText(batch.rawGrams)} />
            <Figure label="Yield (cooked ÷ raw)" value={batch.yieldFactor.toFixed(2)} />
            <Figure label="Carbohydrate per 100 g cooked" value={formatCarb(batch.carbPer100g, unit, { withGrams: true })} />
            <Figure label="Carbohydrate in the batch" value={formatCarb(batch.carbTotal, unit, { withGrams: true })} />
          </View>
        </>
      ) : null}
      <View style={styles.row}>
        <Button variant="quiet" label="‹ Back to weighing" onPress={onBack} />
        <Button size="lg" label="Portion out" disabled={!batch} onPress={onDone} />
      </View>
    </Card>
  );
}

/** The warning above batch numbers whose carbohydrate in the counted basis is unknown (decide with carbUnderstated). */
export function CarbUnknownCallout({ basis }: { basis: CarbBasis }) {
  return (
    <Callout tone="caution" title="Carbohydrate unknown">
      An ingredient has no {basis} carbohydrate value, so the carbohydrate of this batch and its portions is shown as unknown
      rather than as a number that would be too low.
    </Callout>
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
