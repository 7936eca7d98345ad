import { useWatch, type Control } from 'react-hook-form';
import { StyleSheet, View } from 'react-native';
import { formatCarb } from '../../shared/compute/units';
import type { DoseRequest } from '../../shared/schemas/dose';
import type { DayKind } from '../../shared/schemas/profile-settings';
import type { CarbBasis, CarbUnit, GlucoseUnit } from '../../shared/schemas/units';
import { Button } from '../ui/button';
import { Card } from '../ui/card';
import { FormChoiceGroup } from '../ui/form-choice-group';
import { FormGrid } from '../ui/form-grid';
import { FormTextField } from '../ui/form-text-field';
import { Text } from '../ui/text';
import type { DoseFormValues } from './dose-request';
import { EarlierDosesFields } from './earlier-doses-fields';

type DoseControl = Control<DoseFormValues, unknown, DoseRequest>;

/** A row of two fields that wraps on a phone (the one form grid). */
function Pair({ children }: { children: [React.ReactNode, React.ReactNode] }) {
  return <FormGrid minCell={160}>{children}</FormGrid>;
}

type MealProps = {
  control: DoseControl;
  kinds: DayKind[];
  carbBasis: CarbBasis;
  carbUnit: CarbUnit;
  glucoseUnit: GlucoseUnit;
  lookingUp: boolean;
  onLookup: () => void;
};

/** The meal: a portion code to fill in the carbohydrate, the carbohydrate, glucose, time and kind of day. */
export function DoseMealFields({ control, kinds, carbBasis, carbUnit, glucoseUnit, lookingUp, onLookup }: MealProps) {
  const code = useWatch({ control, name: 'portionCode' });
  const carbsTyped = Number(useWatch({ control, name: 'carbsGrams' }).replace(',', '.'));
  return (
    <Card>
      <View style={styles.pair}>
        <View style={styles.grow}>
          <FormTextField
            control={control}
            name="portionCode"
            label="Portion code (optional)"
            autoCapitalize="characters"
            hint="From a container's label: fills in its carbohydrate."
            style={styles.input}
          />
        </View>
        <View style={styles.lookup}>
          <Button variant="secondary" label="Use this portion" loading={lookingUp} disabled={!code.trim()} onPress={onLookup} />
        </View>
      </View>
      <FormTextField
        control={control}
        name="carbsGrams"
        label={`Carbohydrate (${carbBasis === 'available' ? 'available' : 'total'})`}
        unit="g"
        inputMode="decimal"
        hint={Number.isFinite(carbsTyped) && carbsTyped > 0 && carbUnit !== 'g' ? `= ${formatCarb(carbsTyped, carbUnit)}` : 'In grams, as counted in your profile’s basis.'}
      />
      <Pair>
        <FormTextField
          control={control}
          name="glucose"
          style={styles.input}
          label="Glucose now"
          unit={glucoseUnit === 'mmol_l' ? 'mmol/L' : 'mg/dL'}
          inputMode="decimal"
          hint="Leave empty if you have no reading: the correction is then left out."
        />
        <FormTextField
          control={control}
          name="glucoseMinutesAgo"
          style={styles.input}
          label="Reading taken"
          unit="min ago"
          inputMode="numeric"
          hint="How long ago the reading was taken."
        />
      </Pair>
      <FormTextField control={control} name="localTime" label="Meal time" placeholder="12:30" hint="Chooses the time of day whose ratio applies." />
      {kinds.length ? <FormChoiceGroup control={control} name="dayKindId" label="Kind of day" choices={kinds.map((k) => ({ value: k.id, label: k.name }))} /> : null}
    </Card>
  );
}

/** Exercise, earlier doses, a two-part dose, fat and protein. */
export function DoseExtraFields({ control }: { control: DoseControl }) {
  const intensity = useWatch({ control, name: 'exerciseIntensity' });
  const splitOn = useWatch({ control, name: 'splitOn' });
  return (
    <Card>
      <Text variant="heading">Also</Text>
      <FormChoiceGroup
        control={control}
        name="exerciseIntensity"
        label="Exercise after the meal"
        choices={[
          { value: 'none', label: 'None' },
          { value: 'light', label: 'Light' },
          { value: 'moderate', label: 'Moderate' },
          { value: 'hard', label: 'Hard' },
        ]}
      />
      {intensity !== 'none' ? (
        <Pair>
          <FormTextField control={control} name="exerciseDuration" style={styles.input} label="For how long" unit="min" inputMode="numeric" />
          <FormTextField control={control} name="exerciseStartsIn" style={styles.input} label="Starting in" unit="min" inputMode="numeric" />
        </Pair>
      ) : null}
      <EarlierDosesFields control={control} />
      <FormChoiceGroup
        control={control}
        name="splitOn"
        label="Two-part dose (slow or high-fat meal)"
        choices={[
          { value: false, label: 'No' },
          { value: true, label: 'Yes' },
        ]}
      />
      {splitOn ? (
        <Pair>
          <FormTextField control={control} name="splitNow" style={styles.input} label="Now" unit="%" inputMode="numeric" />
          <FormTextField control={control} name="splitLater" style={styles.input} label="Rest after" unit="min" inputMode="numeric" />
        </Pair>
      ) : null}
      <Pair>
        <FormTextField control={control} name="fatGrams" style={styles.input} label="Fat (optional)" unit="g" inputMode="decimal" />
        <FormTextField control={control} name="proteinGrams" style={styles.input} label="Protein (optional)" unit="g" inputMode="decimal" />
      </Pair>
    </Card>
  );
}

const styles = StyleSheet.create({
  pair: { flexDirection: 'row', gap: 12, flexWrap: 'wrap' },
  grow: { flex: 1, minWidth: 140 },
  input: { minWidth: 0 },
  lookup: { justifyContent: 'flex-start', paddingTop: 26 },
});
