import type { FieldPath, FieldValues, RegisterOptions, UseFormRegister } from 'react-hook-form';

/**
 * Wires a form's controls to their labels, errors and the form: `bindField(register)(path,
 * error, options)` is the render prop of a `Field` (components/ui/field.tsx), given the control's
 * id and the id of what describes it.
 */
export const bindField =
  <V extends FieldValues>(register: UseFormRegister<V>) =>
  (path: FieldPath<V>, error: unknown, options?: RegisterOptions<V, FieldPath<V>>) =>
  (id: string, describedBy: string | undefined) => ({
    id,
    'aria-describedby': describedBy,
    'aria-invalid': error ? (true as const) : undefined,
    ...register(path, options),
  });
