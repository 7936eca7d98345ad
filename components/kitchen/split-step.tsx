import { useFieldArray, useFormState, useWatch } from 'react-hook-form';
import { StyleSheet, View } from 'react-native';
import { SPLIT_TOLERANCE_GRAMS, type BatchComputation } from '../../shared/compute/batch';
import type { Container } from '../../shared/schemas/container';
import type { CarbBasis, CarbUnit } from '../../shared/schemas/units';
import { Button } from '../ui/button';
import { Callout } from '../ui/callout';
import { Card } from '../ui/card';
import { FormChoiceGroup } from '../ui/form-choice-group';
import { FormGrid } from '../ui/form-grid';
import { FormTextField } from '../ui/form-text-field';
import { Text } from '../ui/text';
import { formatCarb } from '../../shared/compute/units';
import type { CookForm } from './cook-batch-screen';
import { EMPTY_WEIGHING, num, previewPortions, previewSplit } from './cook-state';
import { containerChoices } from './cooked-weight-step';
import { gramsText } from './kitchen-format';

type Props = {
  form: CookForm;
  containers: Container[];
  batch: BatchComputation;
  basis: CarbBasis;
  unit: CarbUnit;
  onBack: () => void;
  onDone: () => void;
};

/** The split: N equal portions, or containers weighed one by one with the grams left to split. */
export function SplitStep({ form, containers, batch, basis, unit, onBack, onDone }: Props) {
  const { control } = form;
  const portions = useFieldArray({ control, name: 'portions' });
  const [splitMode, countText, weighed] = useWatch({ control, name: ['splitMode', 'count', 'portions'] });
  const { errors } = useFormState({ control, name: 'portions' });
  const preview = previewPortions(weighed, batch, basis);
  const count = num(countText);
  const equalShare = count != null && count <= 100 ? previewSplit(batch, { mode: 'equal', count }, basis)?.[0] : undefined;
  const weighedOk = weighed.length > 0 && preview.nets.every((n) => n != null) && (preview.left ?? 0) >= -SPLIT_TOLERANCE_GRAMS;
  const addPortion = () => {
    const prev = weighed.at(-1);
    portions.append({ containerId: prev?.containerId ?? '', tare: prev?.tare ?? '', gross: '' }, { shouldFocus: false });
  };
  const portionsError = errors.portions?.message ?? errors.portions?.root?.message;

  return (
    <Card aria-label="Portion out">
      <Text variant="heading">Portion out the batch</Text>
      <FormChoiceGroup
        control={control}
        name="splitMode"
        label="How"
        choices={[
          { value: 'weighed', label: 'Weigh each container' },
          { value: 'equal', label: 'Equal portions' },
        ]}
        onChosen={(mode) => {
          if (mode === 'weighed' && !weighed.length) portions.append(EMPTY_WEIGHING, { shouldFocus: false });
        }}
      />
      {splitMode === 'equal' ? (
        <>
          <FormTextField control={control} name="count" label="Number of portions" keyboardType="number-pad" />
          {equalShare ? (
            <Text variant="lead">
              Each portion: {gramsText(equalShare.netGrams)} with {formatCarb(equalShare.carbGrams, unit, { withGrams: true })}
            </Text>
          ) : null}
        </>
      ) : (
        <>
          {portions.fields.map((field, i) => (
            <View key={field.id} style={styles.portion} aria-label={`Container ${i + 1}`}>
              <Text variant="label">Container {i + 1}</Text>
              {containers.length ? (
                <FormChoiceGroup
                  control={control}
                  name={`portions.${i}.containerId`}
                  label="Which container"
                  choices={containerChoices(containers, 'Another')}
                  onChosen={(id) => {
                    const chosen = containers.find((c) => String(c.id) === id);
                    if (chosen) form.setValue(`portions.${i}.tare`, String(chosen.tareGrams));
                  }}
                />
              ) : null}
              <FormGrid minCell={140}>
                <FormTextField control={control} name={`portions.${i}.tare`} label={`Empty container ${i + 1} (tare)`} unit="g" keyboardType="decimal-pad" style={styles.input} />
                <FormTextField control={control} name={`portions.${i}.gross`} label={`Full container ${i + 1} (gross)`} unit="g" keyboardType="decimal-pad" style={styles.input} />
              </FormGrid>
              <Text>
                {preview.nets[i] == null ? 'Net: enter both weights (empty below full).' : `Net ${gramsText(preview.nets[i]!)} · ${formatCarb(preview.carbs[i], unit, { withGrams: true })}`}
              </Text>
              {portions.fields.length > 1 ? <Button variant="quiet" label={`Remove container ${i + 1}`} onPress={() => portions.remove(i)} /> : null}
            </View>
          ))}
          <Button variant="secondary" label="Add a container" onPress={addPortion} />
          {preview.left != null ? (
            preview.left < -SPLIT_TOLERANCE_GRAMS ? (
              <Callout tone="danger" title="More than the pot held">
                {`These containers hold ${gramsText(-preview.left)} more than the ${gramsText(batch.cookedGrams)} in the pot. Check the weights and tares.`}
              </Callout>
            ) : (
              <Text variant="lead" aria-label="Left to portion out">
                Left to portion out: {gramsText(Math.max(0, preview.left))} of {gramsText(batch.cookedGrams)}
              </Text>
            )
          ) : null}
          {portionsError ? <Callout tone="danger">{portionsError}</Callout> : null}
        </>
      )}
      <View style={styles.row}>
        <Button variant="quiet" label="‹ Back to the pot" onPress={onBack} />
        <Button size="lg" label="Storage and use-by" disabled={splitMode === 'equal' ? !equalShare : !weighedOk} onPress={onDone} />
      </View>
    </Card>
  );
}

const styles = StyleSheet.create({
  portion: { gap: 8, paddingVertical: 8 },
  input: { minWidth: 0, width: '100%' },
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: 8, alignItems: 'center' },
});
