import { useController, type Control, type FieldPath, type FieldValues } from 'react-hook-form';
import { TextField, type TextFieldProps } from './text-field';

type Props<T extends FieldValues, TOut extends FieldValues = T> = Omit<TextFieldProps, 'value' | 'onChangeText' | 'onBlur' | 'error'> & {
  /** The form's control; the form may turn its values into another shape on submit (TOut). */
  control: Control<T, unknown, TOut>;
  name: FieldPath<T>;
};

/** TextField bound to react-hook-form; shows the field's validation message under it. */
export function FormTextField<T extends FieldValues, TOut extends FieldValues = T>({ control, name, ...rest }: Props<T, TOut>) {
  const { field, fieldState } = useController({ control, name });
  return (
    <TextField
      {...rest}
      ref={field.ref}
      value={field.value == null ? '' : String(field.value)}
      onChangeText={field.onChange}
      onBlur={field.onBlur}
      error={fieldState.error?.message}
    />
  );
}
