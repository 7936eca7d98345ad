import { useController, type Control, type FieldPath, type FieldValues } from 'react-hook-form';
import { TextField, type TextFieldProps } from './text-field';

type Props<T extends FieldValues> = Omit<TextFieldProps, 'value' | 'onChangeText' | 'onBlur' | 'error'> & {
  control: Control<T>;
  name: FieldPath<T>;
};

/** TextField bound to react-hook-form; shows the field's validation message under it. */
export function FormTextField<T extends FieldValues>({ control, name, ...rest }: Props<T>) {
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
