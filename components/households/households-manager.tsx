'use client';

import useSWR from 'swr';
import { useForm, useWatch } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { Button } from '@/components/ui/button';
import { Card, CardBody, CardHeader, CardTitle } from '@/components/ui/card';
import { Field, Input, fieldA11y } from '@/components/ui/input';
import { Select } from '@/components/ui/select';
import { Table, TBody, TD, TH, THead, TR } from '@/components/ui/table';
import { Badge } from '@/components/ui/badge';
import { toast } from '@/components/ui/toaster';
import { Alert } from '@/components/ui/alert';
import { ApiClientError, apiSend, applyFieldErrors, fetcher } from '@/lib/client/api';
import { ROLES, type Role } from '@/lib/roles';
import { HouseholdInput, PersonInput } from '@/lib/households/schema';
import type { HouseholdDto, PersonDto } from '@/lib/households/types';

const ROLE_NAMES: Record<Role, string> = { coordinator: 'Coordinator', sugarmaker: 'Sugarmaker', member: 'Member' };

interface HouseholdsManagerProps {
  /** The lists as the page was rendered with them on the server. */
  initialHouseholds?: HouseholdDto[];
  initialStaff?: PersonDto[];
}

export function HouseholdsManager({ initialHouseholds, initialStaff }: HouseholdsManagerProps) {
  const households = useSWR<HouseholdDto[]>('/api/households', fetcher, { fallbackData: initialHouseholds });
  const staff = useSWR<PersonDto[]>('/api/people', fetcher, { fallbackData: initialStaff });
  const refresh = () => Promise.all([households.mutate(), staff.mutate()]);

  if (households.error) return <Alert tone="danger">{(households.error as Error).message}</Alert>;

  return (
    <div className="grid gap-6 lg:grid-cols-[2fr_1fr]">
      <Card className="min-w-0">
        <CardHeader>
          <CardTitle>Households and their people</CardTitle>
        </CardHeader>
        <CardBody>
          {!households.data ? (
            <p className="text-slate-muted">Loading households…</p>
          ) : (
            <Table label="Households and their people" stack>
              <THead>
                <TR>
                  <TH>Household</TH>
                  <TH>Person</TH>
                  <TH>Role</TH>
                </TR>
              </THead>
              <TBody>
                {households.data.map((h) =>
                  h.people.length === 0 ? (
                    <TR key={h.id}>
                      <TD label="Household" className="font-semibold">{h.name}</TD>
                      <TD colSpan={2} className="text-slate-muted">
                        No one yet
                      </TD>
                    </TR>
                  ) : (
                    h.people.map((p, i) => (
                      <PersonRow key={p.id} person={p} household={i === 0 ? h.name : ''} households={households.data!} onChanged={refresh} />
                    ))
                  ),
                )}
                {(staff.data ?? []).map((p, i) => (
                  <PersonRow key={p.id} person={p} household={i === 0 ? 'Sugarhouse staff' : ''} households={households.data!} onChanged={refresh} />
                ))}
              </TBody>
            </Table>
          )}
        </CardBody>
      </Card>
      <div className="flex min-w-0 flex-col gap-6">
        <AddHouseholdForm onAdded={refresh} />
        <AddPersonForm households={households.data ?? []} onAdded={refresh} />
      </div>
    </div>
  );
}

interface PersonRowProps {
  person: PersonDto;
  household: string;
  households: HouseholdDto[];
  onChanged: () => Promise<unknown>;
}

function PersonRow({ person, household, households, onChanged }: PersonRowProps) {
  const [role, setRole] = useState<Role>(person.role);
  const [householdId, setHouseholdId] = useState(person.householdId ?? '');
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const dirty = role !== person.role || householdId !== (person.householdId ?? '');
  const selectId = `role-${person.id}`;

  async function save() {
    setBusy(true);
    setError(null);
    try {
      await apiSend('PATCH', `/api/people/${person.id}`, { role, householdId: householdId || null });
      toast.success(`${person.name} is now ${ROLE_NAMES[role].toLowerCase()}.`);
      await onChanged();
    } catch (err) {
      setError(err instanceof ApiClientError ? (err.fields.role ?? err.fields.householdId ?? err.message) : 'Could not save.');
    } finally {
      setBusy(false);
    }
  }

  return (
    <TR>
      <TD label="Household" className="font-semibold">{household}</TD>
      <TD label="Person" className="stack-wide">
        <span className="block">
          {person.name} {person.invited ? <Badge variant="neutral">Invited</Badge> : null}
        </span>
        <span className="block text-sm text-slate-muted">{person.email}</span>
      </TD>
      <TD label="Role" className="stack-wide">
        <div className="flex min-w-40 flex-col gap-2">
          <label htmlFor={selectId} className="sr-only">
            Role of {person.name}
          </label>
          <Select id={selectId} value={role} onChange={(e) => setRole(e.target.value as Role)} aria-invalid={!!error || undefined}>
            {ROLES.map((r) => (
              <option key={r} value={r}>
                {ROLE_NAMES[r]}
              </option>
            ))}
          </Select>
          {role === 'member' && !person.householdId ? (
            <Select aria-label={`Household of ${person.name}`} value={householdId} onChange={(e) => setHouseholdId(e.target.value)}>
              <option value="">Choose a household…</option>
              {households.map((h) => (
                <option key={h.id} value={h.id}>
                  {h.name}
                </option>
              ))}
            </Select>
          ) : null}
          {dirty ? (
            <Button size="sm" onClick={save} loading={busy}>
              Save role
            </Button>
          ) : null}
          {error ? (
            <p role="alert" className="text-sm font-semibold text-ember">
              {error}
            </p>
          ) : null}
        </div>
      </TD>
    </TR>
  );
}

function AddHouseholdForm({ onAdded }: { onAdded: () => Promise<unknown> }) {
  const [formError, setFormError] = useState<string | null>(null);
  const { register, handleSubmit, setError, reset, formState } = useForm<HouseholdInput>({
    resolver: zodResolver(HouseholdInput),
  });
  const onSubmit = handleSubmit(async (values) => {
    setFormError(null);
    try {
      const h = await apiSend<HouseholdDto>('POST', '/api/households', values);
      toast.success(`Added the ${h.name} household.`);
      reset();
      await onAdded();
    } catch (err) {
      setFormError(applyFieldErrors<HouseholdInput>(err, setError, ['name']));
    }
  });
  const nameError = formState.errors.name?.message;
  return (
    <Card>
      <CardHeader>
        <CardTitle>Add a household</CardTitle>
      </CardHeader>
      <CardBody>
        <form onSubmit={onSubmit} className="flex flex-col gap-4" noValidate aria-label="Add a household">
          {formError ? <Alert tone="danger">{formError}</Alert> : null}
          <Field label="Household name" htmlFor="household-name" error={nameError}>
            <Input {...fieldA11y('household-name', nameError)} {...register('name')} />
          </Field>
          <Button type="submit" loading={formState.isSubmitting}>
            Add household
          </Button>
        </form>
      </CardBody>
    </Card>
  );
}

function AddPersonForm({ households, onAdded }: { households: HouseholdDto[]; onAdded: () => Promise<unknown> }) {
  const [formError, setFormError] = useState<string | null>(null);
  const { register, handleSubmit, setError, reset, control, formState } = useForm<PersonInput>({
    resolver: zodResolver(PersonInput),
    defaultValues: { role: 'member', householdId: '' as unknown as null },
  });
  const role = useWatch({ control, name: 'role' });
  const onSubmit = handleSubmit(async (values) => {
    setFormError(null);
    try {
      const p = await apiSend<PersonDto>('POST', '/api/people', { ...values, householdId: values.householdId || null });
      toast.success(`Added ${p.name}; a welcome e-mail is on its way to ${p.email}.`);
      reset({ name: '', email: '', role: values.role, householdId: values.householdId });
      await onAdded();
    } catch (err) {
      setFormError(applyFieldErrors<PersonInput>(err, setError, ['name', 'email', 'role', 'householdId']));
    }
  });
  const e = formState.errors;
  return (
    <Card>
      <CardHeader>
        <CardTitle>Add a person</CardTitle>
      </CardHeader>
      <CardBody>
        <form onSubmit={onSubmit} className="flex flex-col gap-4" noValidate aria-label="Add a person">
          {formError ? <Alert tone="danger">{formError}</Alert> : null}
          <Field label="Name" htmlFor="person-name" error={e.name?.message}>
            <Input {...fieldA11y('person-name', e.name?.message)} autoComplete="off" {...register('name')} />
          </Field>
          <Field label="E-mail" htmlFor="person-email" error={e.email?.message}>
            <Input {...fieldA11y('person-email', e.email?.message)} type="email" autoComplete="off" {...register('email')} />
          </Field>
          <Field label="Role" htmlFor="person-role" error={e.role?.message}>
            <Select {...fieldA11y('person-role', e.role?.message)} {...register('role')}>
              {ROLES.map((r) => (
                <option key={r} value={r}>
                  {ROLE_NAMES[r]}
                </option>
              ))}
            </Select>
          </Field>
          <Field
            label={role === 'member' ? 'Household' : 'Household (optional)'}
            htmlFor="person-household"
            error={e.householdId?.message}
          >
            <Select
              {...fieldA11y('person-household', e.householdId?.message)}
              {...register('householdId', { setValueAs: (v) => (v ? v : null) })}
            >
              <option value="">{role === 'member' ? 'Choose a household…' : 'No household'}</option>
              {households.map((h) => (
                <option key={h.id} value={h.id}>
                  {h.name}
                </option>
              ))}
            </Select>
          </Field>
          <Button type="submit" loading={formState.isSubmitting}>
            Add person and send welcome e-mail
          </Button>
        </form>
      </CardBody>
    </Card>
  );
}
