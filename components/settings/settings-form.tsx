'use client';

import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import type { z } from 'zod';
import { Button } from '@/components/ui/button';
import { Field, Input, fieldA11y } from '@/components/ui/input';
import { Alert } from '@/components/ui/alert';
import { toast } from '@/components/ui/toaster';
import { apiSend, applyFieldErrors } from '@/lib/client/api';
import { SettingsInput } from '@/lib/settings/schema';

type FormValues = z.input<typeof SettingsInput>;
type Saved = z.output<typeof SettingsInput>;

interface SettingsFormProps {
  initial: Saved;
}

const FIELDS: { name: keyof FormValues; label: string; hint?: string; type?: string; step?: string }[] = [
  { name: 'opensAt', label: 'Sugarhouse opens', type: 'time', hint: 'Members book inside these hours; sugarmakers may book others.' },
  { name: 'closesAt', label: 'Sugarhouse closes', type: 'time' },
  { name: 'slotMinMinutes', label: 'Shortest slot (minutes)', step: '15' },
  { name: 'slotMaxMinutes', label: 'Longest slot (minutes)', step: '15' },
  { name: 'cancelNoticeHours', label: 'Members may cancel until (hours before start)' },
  { name: 'syrupBrix', label: 'Finish syrup to (°Bx)', step: '0.1', hint: 'Grade A: 66.0–68.9 °Bx (USDA). Vermont requires at least 66.9.' },
  { name: 'shelfDays', label: 'Cold sap keeps (days)', step: '0.5', hint: 'Common trade practice: about a week when kept at or below 3–4 °C.' },
  { name: 'warmAboveC', label: 'Sap counts as warm above (°C)', step: '0.5' },
  { name: 'warmShelfDays', label: 'Warm sap keeps (days)', step: '0.5' },
];

export function SettingsForm({ initial }: SettingsFormProps) {
  const [formError, setFormError] = useState<string | null>(null);
  const { register, handleSubmit, setError, reset, formState } = useForm<FormValues, unknown, Saved>({
    resolver: zodResolver(SettingsInput),
    defaultValues: initial,
  });
  const onSubmit = handleSubmit(async (values) => {
    setFormError(null);
    try {
      const saved = await apiSend<Saved>('PATCH', '/api/settings', values);
      reset(saved);
      toast.success('Settings saved.');
    } catch (err) {
      setFormError(applyFieldErrors<FormValues>(err, setError, FIELDS.map((f) => f.name)));
    }
  });
  return (
    <form onSubmit={onSubmit} noValidate aria-label="Co-op settings" className="flex flex-col gap-4">
      {formError ? <Alert tone="danger">{formError}</Alert> : null}
      <div className="grid gap-4 sm:grid-cols-2">
        {FIELDS.map((f) => {
          const error = formState.errors[f.name]?.message;
          const id = `setting-${f.name}`;
          return (
            <Field key={f.name} label={f.label} htmlFor={id} error={error} hint={f.hint}>
              <Input
                {...fieldA11y(id, error, f.hint)}
                type={f.type ?? 'number'}
                step={f.step}
                inputMode={f.type ? undefined : 'decimal'}
                {...register(f.name)}
              />
            </Field>
          );
        })}
      </div>
      <div>
        <Button type="submit" loading={formState.isSubmitting}>
          Save settings
        </Button>
      </div>
    </form>
  );
}
