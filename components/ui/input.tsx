import type { ComponentProps, ReactNode } from 'react';
import { cva } from 'class-variance-authority';
import { cn } from '@/lib/utils';

/** The look shared by every text-like form control (Input, Textarea, Select). */
export const controlVariants = cva([
  'block w-full min-h-touch rounded-lg border border-birch-edge bg-birch-raised px-3 py-2',
  'text-base text-slate placeholder:text-slate-muted',
  'transition-colors duration-150',
  'disabled:cursor-not-allowed disabled:bg-birch disabled:text-slate-muted',
  'aria-invalid:border-ember aria-invalid:ring-1 aria-invalid:ring-ember',
]);

export type InputProps = ComponentProps<'input'>;

export function Input({ className, type = 'text', ...props }: InputProps) {
  return <input type={type} className={cn(controlVariants(), className)} {...props} />;
}

export type TextareaProps = ComponentProps<'textarea'>;

export function Textarea({ className, rows = 4, ...props }: TextareaProps) {
  return <textarea rows={rows} className={cn(controlVariants(), 'resize-y leading-relaxed', className)} {...props} />;
}

export type LabelProps = ComponentProps<'label'>;

export function Label({ className, ...props }: LabelProps) {
  return <label className={cn('block text-base font-semibold text-slate', className)} {...props} />;
}

export interface FieldProps {
  label: ReactNode;
  /** The id of the control inside; the hint and error ids are derived from it. */
  htmlFor: string;
  error?: ReactNode;
  hint?: ReactNode;
  children: ReactNode;
  className?: string;
}

/**
 * Label, control, hint and error in one column. The control itself must carry
 * `aria-invalid` and `aria-describedby`; spread `fieldA11y(id, error, hint)` on it.
 */
export function Field({ label, htmlFor, error, hint, children, className }: FieldProps) {
  return (
    <div className={cn('flex flex-col gap-1.5', className)}>
      <Label htmlFor={htmlFor}>{label}</Label>
      {children}
      {hint ? (
        <p id={`${htmlFor}-hint`} className="text-sm text-slate-muted">
          {hint}
        </p>
      ) : null}
      {error ? (
        <p id={`${htmlFor}-error`} role="alert" className="text-sm font-semibold text-ember">
          {error}
        </p>
      ) : null}
    </div>
  );
}

export interface FieldA11yProps {
  id: string;
  'aria-invalid': true | undefined;
  'aria-describedby': string | undefined;
}

/**
 * The accessibility props for a control inside a Field. Pass `hint` too when the
 * Field shows one, so screen readers read it with the control.
 */
export function fieldA11y(id: string, error?: unknown, hint?: unknown): FieldA11yProps {
  const describedBy = [hint ? `${id}-hint` : null, error ? `${id}-error` : null].filter(Boolean).join(' ');
  return {
    id,
    'aria-invalid': !!error || undefined,
    'aria-describedby': describedBy || undefined,
  };
}
