import { useController, type Control, type FieldPath, type FieldValues } from 'react-hook-form';
import { ChoiceGroup, type ChoiceGroupProps } from './choice-group';

type Props<T extends FieldValues, V extends string | number | boolean, TOut extends FieldValues = T> = Omit<ChoiceGroupProps<V>, 'value' | 'onChange' | 'error'> & {
  control: Control<T, unknown, TOut>;
  name: FieldPath<T>;
  /** Runs after the field is set, with the value it had before (e.g. a pot's tare filled in from the chosen pot). */
  onChosen?: (value: V, previous: V) => void;
};

/** ChoiceGroup bound to react-hook-form; shows the field's validation message under it. */
export function FormChoiceGroup<T extends FieldValues, V extends string | number | boolean, TOut extends FieldValues = T>({
  control,
  name,
  onChosen,
  ...rest
}: Props<T, V, TOut>) {
  const { field, fieldState } = useController({ control, name });
  return (
    <ChoiceGroup<V>
      {...rest}
      value={field.value as V | null}
      onChange={(v) => {
        const previous = field.value as V;
        field.onChange(v);
        onChosen?.(v, previous);
      }}
      error={fieldState.error?.message}
    />
  );
}
