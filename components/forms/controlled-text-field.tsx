// A TextField bound to a react-hook-form field through Controller.
import { Controller, type Control, type FieldValues, type Path } from 'react-hook-form';
import { TextField, type TextFieldProps } from '../ui/text-field';

export interface ControlledTextFieldProps<T extends FieldValues>
  extends Omit<TextFieldProps, 'value' | 'onChangeText' | 'error' | 'ref'> {
  control: Control<T>;
  name: Path<T>;
}

export function ControlledTextField<T extends FieldValues>({ control, name, onBlur, ...field }: ControlledTextFieldProps<T>) {
  return (
    <Controller
      control={control}
      name={name}
      render={({ field: bound, fieldState }) => (
        <TextField
          {...field}
          ref={bound.ref}
          value={(bound.value as string | undefined) ?? ''}
          onChangeText={bound.onChange}
          onBlur={(e) => {
            bound.onBlur();
            onBlur?.(e);
          }}
          error={fieldState.error?.message}
        />
      )}
    />
  );
}
