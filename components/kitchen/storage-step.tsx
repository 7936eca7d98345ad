import { StyleSheet, View } from 'react-native';
import { defaultUseBy } from '../../shared/compute/use-by';
import { Button } from '../ui/button';
import { Callout } from '../ui/callout';
import { Card } from '../ui/card';
import { Text } from '../ui/text';
import { TextField } from '../ui/text-field';
import { ChoiceGroup } from '../ui/choice-group';
import type { CookState } from './cook-state';

type Props = {
  state: CookState;
  containsRice: boolean;
  errors: Record<string, string>;
  formError?: string;
  saving: boolean;
  onChange: (patch: Partial<CookState>) => void;
  onBack: () => void;
  onSave: () => void;
};

/** Fridge or freezer, the cooking date, and a use-by date defaulted from food-safety advice (editable, source shown). */
export function StorageStep({ state, containsRice, errors, formError, saving, onChange, onBack, onSave }: Props) {
  const validDate = /^\d{4}-\d{2}-\d{2}$/.test(state.cookedOn);
  const rule = validDate ? defaultUseBy(state.cookedOn, state.storage, state.region, containsRice) : null;
  const reset = (patch: Partial<CookState>) => {
    const next = { ...state, ...patch };
    const r = /^\d{4}-\d{2}-\d{2}$/.test(next.cookedOn) ? defaultUseBy(next.cookedOn, next.storage, next.region, containsRice) : null;
    onChange({ ...patch, useBy: r?.useBy ?? next.useBy });
  };
  return (
    <Card aria-label="Storage">
      <Text variant="heading">Storage and use-by</Text>
      <ChoiceGroup
        label="Where it goes"
        value={state.storage}
        onChange={(storage) => reset({ storage })}
        choices={[
          { value: 'fridge', label: 'Fridge' },
          { value: 'freezer', label: 'Freezer' },
        ]}
      />
      <ChoiceGroup
        label="Food-safety advice to follow"
        value={state.region}
        onChange={(region) => reset({ region })}
        choices={[
          { value: 'uk', label: 'UK (Food Standards Agency)' },
          { value: 'us', label: 'US (USDA)' },
        ]}
      />
      <TextField label="Cooked on" value={state.cookedOn} onChangeText={(cookedOn) => reset({ cookedOn })} error={errors.cookedOn} placeholder="YYYY-MM-DD" />
      <TextField
        label="Use by"
        value={state.useBy}
        onChangeText={(useBy) => onChange({ useBy })}
        error={errors.useBy}
        placeholder="YYYY-MM-DD"
        hint={rule ? `Default ${rule.useBy} — ${rule.source}. ${rule.note}` : undefined}
      />
      <Callout tone="caution" title="Food safety">
        Cool the food quickly and refrigerate within 2 hours; reheat until steaming hot. These dates follow general advice —
        your local food-safety authority has the last word.
      </Callout>
      {formError ? <Callout tone="danger">{formError}</Callout> : null}
      <View style={styles.row}>
        <Button variant="quiet" label="‹ Back to the split" onPress={onBack} />
        <Button size="lg" label="Save batch and portions" loading={saving} onPress={onSave} />
      </View>
    </Card>
  );
}

const styles = StyleSheet.create({ row: { flexDirection: 'row', flexWrap: 'wrap', gap: 8, alignItems: 'center' } });
