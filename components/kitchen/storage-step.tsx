import { useWatch } from 'react-hook-form';
import { StyleSheet, View } from 'react-native';
import { defaultUseBy } from '../../shared/compute/use-by';
import { Button } from '../ui/button';
import { Callout } from '../ui/callout';
import { Card } from '../ui/card';
import { FormChoiceGroup } from '../ui/form-choice-group';
import { FormTextField } from '../ui/form-text-field';
import { Text } from '../ui/text';
import type { CookForm } from './cook-batch-screen';

type Props = {
  form: CookForm;
  containsRice: boolean;
  formError?: string;
  saving: boolean;
  onBack: () => void;
  onSave: () => void;
};

/** Fridge or freezer, the cooking date, and a use-by date defaulted from food-safety advice (editable, source shown). */
export function StorageStep({ form, containsRice, formError, saving, onBack, onSave }: Props) {
  const { control } = form;
  const [cookedOn, storage, region] = useWatch({ control, name: ['cookedOn', 'storage', 'region'] });
  const rule = /^\d{4}-\d{2}-\d{2}$/.test(cookedOn) ? defaultUseBy(cookedOn, storage, region, containsRice) : null;
  return (
    <Card aria-label="Storage">
      <Text variant="heading">Storage and use-by</Text>
      <FormChoiceGroup
        control={control}
        name="storage"
        label="Where it goes"
        choices={[
          { value: 'fridge', label: 'Fridge' },
          { value: 'freezer', label: 'Freezer' },
        ]}
      />
      <FormChoiceGroup
        control={control}
        name="region"
        label="Food-safety advice to follow"
        choices={[
          { value: 'uk', label: 'UK (Food Standards Agency)' },
          { value: 'us', label: 'US (USDA)' },
        ]}
      />
      <FormTextField control={control} name="cookedOn" label="Cooked on" placeholder="YYYY-MM-DD" />
      <FormTextField
        control={control}
        name="useBy"
        label="Use by"
        placeholder="YYYY-MM-DD"
        hint={rule ? `Default ${rule.useBy}. ${rule.note}` : undefined}
      />
      <Callout tone="caution" title="Food safety">
        Cool the food quickly and refrigerate within 2 hours; reheat until steaming hot. These dates follow general advice —
        your local food-safety authority has the last word.
      </Callout>
      {formError ? <Callout tone="danger">{formError}</Callout> : null}
      <View style={styles.row}>
        <Button variant="quiet" label="‹ Back to portioning out" onPress={onBack} />
        <Button size="lg" label="Save batch and portions" loading={saving} onPress={onSave} />
      </View>
    </Card>
  );
}

const styles = StyleSheet.create({ row: { flexDirection: 'row', flexWrap: 'wrap', gap: 8, alignItems: 'center' } });
