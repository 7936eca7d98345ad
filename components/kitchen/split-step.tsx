import { StyleSheet, View } from 'react-native';
import { SPLIT_TOLERANCE_GRAMS, type BatchComputation } from '../../shared/compute/batch';
import type { Container } from '../../shared/schemas/container';
import type { CarbUnit } from '../../shared/schemas/units';
import { Button } from '../ui/button';
import { Callout } from '../ui/callout';
import { Card } from '../ui/card';
import { Text } from '../ui/text';
import { TextField } from '../ui/text-field';
import { ChoiceGroup } from '../ui/choice-group';
import { num, previewJars, type CookState, type Weighing } from './cook-state';
import { carbText, gramsText } from './kitchen-format';

type Props = {
  state: CookState;
  containers: Container[];
  batch: BatchComputation;
  unit: CarbUnit;
  errors: Record<string, string>;
  onChange: (patch: Partial<CookState>) => void;
  onBack: () => void;
  onDone: () => void;
};

/** The split: N equal portions, or containers weighed one by one with the grams left to split. */
export function SplitStep({ state, containers, batch, unit, errors, onChange, onBack, onDone }: Props) {
  const jars = previewJars(state, batch);
  const count = num(state.count);
  const equalOk = count != null && Number.isInteger(count) && count >= 1 && count <= 100;
  const weighedOk = state.jars.length > 0 && jars.nets.every((n) => n != null) && (jars.left ?? 0) >= -SPLIT_TOLERANCE_GRAMS;
  const setJar = (i: number, jar: Weighing) => onChange({ jars: state.jars.map((j, k) => (k === i ? jar : j)) });
  const addJar = () => {
    const prev = state.jars.at(-1);
    onChange({ jars: [...state.jars, { containerId: prev?.containerId ?? null, tare: prev?.tare ?? '', gross: '' }] });
  };

  return (
    <Card aria-label="Split into portions">
      <Text variant="heading">Split into portions</Text>
      <ChoiceGroup
        label="How"
        value={state.splitMode}
        onChange={(splitMode) => onChange({ splitMode, jars: splitMode === 'weighed' && !state.jars.length ? [{ containerId: null, tare: '', gross: '' }] : state.jars })}
        choices={[
          { value: 'weighed', label: 'Weigh each container' },
          { value: 'equal', label: 'Equal portions' },
        ]}
      />
      {state.splitMode === 'equal' ? (
        <>
          <TextField label="Number of portions" keyboardType="number-pad" value={state.count} onChangeText={(c) => onChange({ count: c })} error={errors['split.count']} />
          {equalOk ? (
            <Text variant="lead">
              Each portion: {gramsText(batch.cookedGrams / count!)} with {carbText(batch.carbTotal == null ? null : batch.carbTotal / count!, unit)}
            </Text>
          ) : null}
        </>
      ) : (
        <>
          {state.jars.map((jar, i) => (
            <View key={i} style={styles.jar} aria-label={`Container ${i + 1}`}>
              <Text variant="label">Container {i + 1}</Text>
              {containers.length ? (
                <ChoiceGroup
                  label="Which container"
                  value={String(jar.containerId ?? 'other')}
                  onChange={(v) => {
                    const chosen = containers.find((c) => String(c.id) === v);
                    setJar(i, { ...jar, containerId: chosen?.id ?? null, tare: chosen ? String(chosen.tareGrams) : jar.tare });
                  }}
                  choices={[...containers.map((c) => ({ value: String(c.id), label: `${c.name} (${gramsText(c.tareGrams)})` })), { value: 'other', label: 'Another' }]}
                />
              ) : null}
              <View style={styles.pair}>
                <View style={styles.grow}>
                  <TextField label={`Empty container ${i + 1} (tare)`} unit="g" keyboardType="decimal-pad" value={jar.tare} onChangeText={(tare) => setJar(i, { ...jar, tare })} error={errors[`split.portions.${i}.tareGrams`]} style={styles.input} />
                </View>
                <View style={styles.grow}>
                  <TextField label={`Full container ${i + 1} (gross)`} unit="g" keyboardType="decimal-pad" value={jar.gross} onChangeText={(gross) => setJar(i, { ...jar, gross })} error={errors[`split.portions.${i}.grossGrams`]} style={styles.input} />
                </View>
              </View>
              <Text>
                {jars.nets[i] == null ? 'Net: enter both weights (empty below full).' : `Net ${gramsText(jars.nets[i]!)} · ${carbText(jars.carbs[i], unit)}`}
              </Text>
              {state.jars.length > 1 ? <Button variant="quiet" label={`Remove container ${i + 1}`} onPress={() => onChange({ jars: state.jars.filter((_, k) => k !== i) })} /> : null}
            </View>
          ))}
          <Button variant="secondary" label="Add a container" onPress={addJar} />
          {jars.left != null ? (
            jars.left < -SPLIT_TOLERANCE_GRAMS ? (
              <Callout tone="danger" title="More than the pot held">
                {`These containers hold ${gramsText(-jars.left)} more than the ${gramsText(batch.cookedGrams)} in the pot. Check the weights and tares.`}
              </Callout>
            ) : (
              <Text variant="lead" aria-label="Left to split">
                Left to split: {gramsText(Math.max(0, jars.left))} of {gramsText(batch.cookedGrams)}
              </Text>
            )
          ) : null}
          {errors['split.portions'] ? <Callout tone="danger">{errors['split.portions']}</Callout> : null}
        </>
      )}
      <View style={styles.row}>
        <Button variant="quiet" label="‹ Back to the pot" onPress={onBack} />
        <Button size="lg" label="Storage and use-by" disabled={state.splitMode === 'equal' ? !equalOk : !weighedOk} onPress={onDone} />
      </View>
    </Card>
  );
}

const styles = StyleSheet.create({
  jar: { gap: 8, paddingVertical: 8 },
  pair: { flexDirection: 'row', gap: 12, flexWrap: 'wrap' },
  grow: { flexGrow: 1, flexBasis: 140, minWidth: 0 },
  input: { minWidth: 0, width: '100%' },
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: 8, alignItems: 'center' },
});
