import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm, type FieldPath } from 'react-hook-form';
import { StyleSheet, View } from 'react-native';
import { EXERCISE_INTENSITIES } from '../../shared/compute/exercise';
import { glucoseFromMmol, glucoseToMmol } from '../../shared/compute/units';
import {
  ACTIVE_INSULIN_MODEL_WORDS,
  profileSettingsInputSchema,
  type ProfileSettingsFormValues,
  type ProfileSettingsInput,
} from '../../shared/schemas/profile-settings';
import { PREFERRED_FOOD_TABLE_CHOICES, type GlucoseUnit } from '../../shared/schemas/units';
import { Button } from '../ui/button';
import { Callout } from '../ui/callout';
import { Card } from '../ui/card';
import { FormGrid } from '../ui/form-grid';
import { FormTextField } from '../ui/form-text-field';
import { Text } from '../ui/text';
import { FormChoiceGroup } from '../ui/form-choice-group';

const GLUCOSE_FIELDS = ['targetLow', 'targetHigh', 'correctionTarget', 'hypoThreshold', 'veryHigh'] as const;
export const SETTINGS_FIELDS: FieldPath<ProfileSettingsFormValues>[] = [
  'glucoseUnit', 'carbBasis', 'carbUnit', 'preferredFoodTable', 'penIncrement', 'rounding', 'maxDoseUnits', 'actionTimeHours', 'activeInsulinModel', ...GLUCOSE_FIELDS,
  'allowNegativeCorrection', 'iobConvention',
  ...EXERCISE_INTENSITIES.flatMap((k) => [`exerciseReductions.${k}.min30`, `exerciseReductions.${k}.min60`] as FieldPath<ProfileSettingsFormValues>[]),
];

const unitWord = (u: GlucoseUnit) => (u === 'mmol_l' ? 'mmol/L' : 'mg/dL');
const INTENSITY_WORDS = { light: 'Light (walking, gardening)', moderate: 'Moderate (brisk walk, jog, easy ride)', hard: 'Hard (fast ride, running, team sport)' } as const;

function convertField(value: unknown, from: GlucoseUnit, to: GlucoseUnit): unknown {
  const n = typeof value === 'number' ? value : Number(String(value ?? '').replace(',', '.'));
  if (value === '' || value == null || !Number.isFinite(n)) return value;
  const out = glucoseFromMmol(glucoseToMmol(n, from), to);
  return to === 'mmol_l' ? String(Math.round(out * 10) / 10) : String(Math.round(out));
}

/** Units and safety limits form (react-hook-form + the shared zod schema). */
export function UnitsSafetyForm({
  defaultValues,
  onSubmit,
  submitting,
  formError,
}: {
  defaultValues: ProfileSettingsFormValues;
  onSubmit: (values: ProfileSettingsInput, form: ReturnType<typeof useForm<ProfileSettingsFormValues, unknown, ProfileSettingsInput>>) => void;
  submitting: boolean;
  formError?: string;
}) {
  const form = useForm<ProfileSettingsFormValues, unknown, ProfileSettingsInput>({ resolver: zodResolver(profileSettingsInputSchema), defaultValues });
  const [unit, setUnit] = useState<GlucoseUnit>(defaultValues.glucoseUnit);
  const submit = form.handleSubmit((values) => onSubmit(values, form));
  const u = unitWord(unit);

  return (
    <View style={styles.stack}>
      {formError ? <Callout tone="danger" title="Not saved">{formError}</Callout> : null}
      <Card>
        <Text variant="heading">Units</Text>
        <FormChoiceGroup
          control={form.control}
          name="glucoseUnit"
          label="Glucose unit"
          choices={[{ value: 'mmol_l', label: 'mmol/L' }, { value: 'mg_dl', label: 'mg/dL' }]}
          hint="1 mmol/L = 18.0156 mg/dL. Values are converted for you when you switch."
          onChosen={(next: GlucoseUnit, previous: GlucoseUnit) => {
            if (next !== previous) {
              for (const name of GLUCOSE_FIELDS) form.setValue(name, convertField(form.getValues(name), previous, next));
            }
            setUnit(next);
          }}
        />
        <FormChoiceGroup
          control={form.control}
          name="carbBasis"
          label="Carbohydrate you count"
          choices={[{ value: 'available', label: 'Available (fibre not counted)' }, { value: 'total', label: 'Total (fibre included)' }]}
        />
        <FormChoiceGroup
          control={form.control}
          name="carbUnit"
          label="Show carbohydrate as"
          choices={[
            { value: 'g', label: 'grams' },
            { value: 'portion10', label: '10 g portions' },
            { value: 'unit12', label: '12 g units' },
            { value: 'exchange15', label: '15 g exchanges' },
          ]}
        />
        <FormChoiceGroup
          control={form.control}
          name="preferredFoodTable"
          label="Food table shown first in search"
          choices={PREFERRED_FOOD_TABLE_CHOICES}
          hint="Both tables are always searched; this one comes first when both have the food."
        />
      </Card>
      <Card>
        <Text variant="heading">Pen and limits</Text>
        <FormChoiceGroup
          control={form.control}
          name="penIncrement"
          label="Pen step"
          choices={[{ value: 0.5, label: '0.5 unit' }, { value: 1, label: '1 unit' }]}
        />
        <FormChoiceGroup
          control={form.control}
          name="rounding"
          label="Rounding to the pen step"
          choices={[{ value: 'down', label: 'Down (safer)' }, { value: 'nearest', label: 'Nearest' }]}
          hint="Rounding down is the more cautious choice."
        />
        <FormGrid>
          <FormTextField control={form.control} name="maxDoseUnits" label="Largest single dose" unit="units" inputMode="decimal" />
          <FormTextField control={form.control} name="actionTimeHours" label="Insulin action time" unit="hours" inputMode="decimal" hint="2 to 8 hours, as your team set it." />
        </FormGrid>
        <FormChoiceGroup
          control={form.control}
          name="activeInsulinModel"
          label="Insulin still active from earlier doses falls as"
          choices={[
            { value: 'linear', label: `${ACTIVE_INSULIN_MODEL_WORDS.linear} (default)` },
            { value: 'curve', label: ACTIVE_INSULIN_MODEL_WORDS.curve },
          ]}
          hint="The straight line counts half a dose as active halfway through the action time, as the education advice does. The curve counts more in the first hour and less after that, so it can suggest more insulin; ask your diabetes team."
        />
      </Card>
      <Card>
        <Text variant="heading">Glucose targets</Text>
        <FormGrid>
          <FormTextField control={form.control} name="targetLow" label="Target range from" unit={u} inputMode="decimal" />
          <FormTextField control={form.control} name="targetHigh" label="Target range to" unit={u} inputMode="decimal" />
          <FormTextField control={form.control} name="correctionTarget" label="Correct to" unit={u} inputMode="decimal" hint="Corrections aim for this value." />
          <FormTextField
            control={form.control}
            name="hypoThreshold"
            label="Low: no dose at or below"
            unit={u}
            inputMode="decimal"
            hint="Usually 3.9 mmol/L (70 mg/dL)."
          />
          <FormTextField
            control={form.control}
            name="veryHigh"
            label="Very high: check ketones from"
            unit={u}
            inputMode="decimal"
            hint="Often 15 mmol/L (270 mg/dL), above all before exercise."
          />
        </FormGrid>
        <FormChoiceGroup
          control={form.control}
          name="allowNegativeCorrection"
          label="Below the range, lower the meal dose (negative correction)"
          choices={[{ value: false, label: 'No' }, { value: true, label: 'Yes' }]}
        />
        <FormChoiceGroup
          control={form.control}
          name="iobConvention"
          label="Active insulin from earlier doses is taken off"
          choices={[{ value: 'correction_only', label: 'The correction only' }, { value: 'total', label: 'The whole dose' }]}
        />
      </Card>
      <Card>
        <Text variant="heading">Exercise after a meal</Text>
        <Text color="textMuted">
          Percent taken off the meal part when exercise starts within 3 hours of the meal. Set these with your diabetes
          team. Empty means no reduction is made.
        </Text>
        {EXERCISE_INTENSITIES.map((k) => (
          <View key={k} style={styles.grid}>
            <Text weight="bold">{INTENSITY_WORDS[k]}</Text>
            <FormGrid minCell={140}>
              <FormTextField control={form.control} name={`exerciseReductions.${k}.min30`} label="About 30 min" unit="%" inputMode="decimal" style={styles.input} />
              <FormTextField control={form.control} name={`exerciseReductions.${k}.min60`} label="About 60 min" unit="%" inputMode="decimal" style={styles.input} />
            </FormGrid>
          </View>
        ))}
      </Card>
      <Button label="Save units and limits" size="lg" loading={submitting} onPress={submit} />
    </View>
  );
}

const styles = StyleSheet.create({
  stack: { gap: 16 },
  grid: { gap: 12 },
  input: { minWidth: 0 },
});
