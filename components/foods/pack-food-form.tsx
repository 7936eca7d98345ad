import { zodResolver } from '@hookform/resolvers/zod';
import { useEffect, useState } from 'react';
import { useForm, useWatch } from 'react-hook-form';
import { StyleSheet, View } from 'react-native';
import type { CreatePackFoodValues } from '../../shared/schemas/food';
import type { PackPhotoFile } from '../api/foods';
import { applyServerErrors } from '../ui/form-errors';
import { Button } from '../ui/button';
import { Callout } from '../ui/callout';
import { Card } from '../ui/card';
import { FormTextField } from '../ui/form-text-field';
import { Text } from '../ui/text';
import { FormChoiceGroup } from '../ui/form-choice-group';
import { emptyPackFood, packFoodFieldOf, packFoodFormSchema, type PackFoodFormValues } from './pack-food-form-values';
import { PhotoInput } from './photo-input';

export type ShareOption = { profileId: number | null; label: string };

type Props = {
  onSubmit: (values: CreatePackFoodValues, photo: PackPhotoFile | null) => void;
  submitting?: boolean;
  /** The error of the last submit, if any: field errors are placed on their fields. */
  submitError?: unknown;
  shareOptions: ShareOption[];
  defaultValues?: PackFoodFormValues;
  submitLabel?: string;
  /** False when editing: the label photo is kept as it is. */
  withPhoto?: boolean;
};

/** The add-a-pack-food form: values as printed, per 100 g or per serving, with the label's carbohydrate convention. */
export function PackFoodForm({ onSubmit, submitting, submitError, shareOptions, defaultValues = emptyPackFood, submitLabel = 'Save pack food', withPhoto = true }: Props) {
  const form = useForm<PackFoodFormValues, unknown, CreatePackFoodValues>({ resolver: zodResolver(packFoodFormSchema), defaultValues, mode: 'onSubmit' });
  const [photo, setPhoto] = useState<PackPhotoFile | null>(null);
  const [formError, setFormError] = useState<string | undefined>();
  const basis = useWatch({ control: form.control, name: 'basis' });
  const convention = useWatch({ control: form.control, name: 'convention' });
  const per = basis === 'perServing' ? 'per serving' : 'per 100 g';

  useEffect(() => {
    if (submitError) setFormError(applyServerErrors(submitError, form.setError, packFoodFieldOf));
  }, [submitError, form.setError]);

  const submit = form.handleSubmit((values) => {
    setFormError(undefined);
    onSubmit(values, photo);
  });

  return (
    <View style={styles.wrap}>
      <Card>
        <FormTextField control={form.control} name="name" label="Food name" placeholder="e.g. Rolled oat crackers" />
        <FormTextField control={form.control} name="brand" label="Brand (optional)" />
      </Card>
      <Card>
        <FormChoiceGroup
          control={form.control}
          name="basis"
          label="The label's values are"
          choices={[
            { value: 'per100g', label: 'Per 100 g' },
            { value: 'perServing', label: 'Per serving', hint: 'We convert to per 100 g from the serving weight.' },
          ]}
        />
        {basis === 'perServing' ? <FormTextField control={form.control} name="servingGrams" label="Serving weight" unit="g" keyboardType="decimal-pad" /> : null}
        <FormChoiceGroup
          control={form.control}
          name="convention"
          label="Kind of label"
          choices={[
            { value: 'eu', label: 'EU / UK “Carbohydrate”', hint: 'Available carbohydrate: fibre is listed separately, not included.' },
            { value: 'us', label: 'US “Total carbohydrate”', hint: 'Fibre is included in the total.' },
          ]}
        />
      </Card>
      <Card>
        <Text variant="heading">Values {per}, as printed</Text>
        <FormTextField
          control={form.control}
          name="carbohydrate"
          label={convention === 'us' ? 'Total carbohydrate' : 'Carbohydrate'}
          unit="g"
          keyboardType="decimal-pad"
        />
        <FormTextField control={form.control} name="fibre" label="Fibre" unit="g" keyboardType="decimal-pad" hint="Leave blank if the label does not give it." />
        <FormTextField control={form.control} name="sugars" label="of which sugars" unit="g" keyboardType="decimal-pad" />
        <FormTextField control={form.control} name="protein" label="Protein" unit="g" keyboardType="decimal-pad" />
        <FormTextField control={form.control} name="fat" label="Fat" unit="g" keyboardType="decimal-pad" />
        <FormTextField control={form.control} name="energyKcal" label="Energy" unit="kcal" keyboardType="decimal-pad" />
      </Card>
      {withPhoto || shareOptions.length > 1 ? (
        <Card>
          {withPhoto ? <Text variant="heading">Photo of the label</Text> : null}
          {withPhoto ? <PhotoInput value={photo} onChange={setPhoto} /> : null}
          {shareOptions.length > 1 ? (
            <FormChoiceGroup
              control={form.control}
              name="share"
              label="Who can use this food"
              choices={shareOptions.map((o) => ({ value: String(o.profileId ?? 'private'), label: o.label }))}
            />
          ) : null}
        </Card>
      ) : null}
      <Callout tone="info" title="Check against the pack">
        Label values are the maker&apos;s declaration and are rounded; Carbwright uses them exactly as you type them.
      </Callout>
      {formError ? <Callout tone="danger" title="Not saved">{formError}</Callout> : null}
      <Button label={submitLabel} size="lg" loading={submitting} onPress={() => void submit()} />
    </View>
  );
}

const styles = StyleSheet.create({ wrap: { gap: 16 } });
