'use client';

import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { z } from 'zod';
import { ApiError } from '@/lib/api/client';
import { Button } from '@/components/ui/button';
import { Field, TextInput } from '@/components/ui/field';
import { Alert } from '@/components/ui/alert';

// The API's own rule (lib/api/scene-schemas.ts nameSchema), repeated here for instant feedback.
const schema = z.object({ name: z.string().trim().min(1, 'Give it a name.').max(160, 'Names are at most 160 characters.') });

/** One-field "name it and create" form for shows and scenes. */
export function NameForm({ label, submitLabel, testId, onCreate }: { label: string; submitLabel: string; testId: string; onCreate: (name: string) => Promise<unknown> }) {
  const [failure, setFailure] = useState<string | null>(null);
  const { register, handleSubmit, reset, setError, formState } = useForm<{ name: string }>({ resolver: zodResolver(schema), defaultValues: { name: '' } });
  const id = `${testId}-name`;
  return (
    <form
      noValidate
      data-testid={testId}
      className="flex flex-wrap items-end gap-3"
      onSubmit={handleSubmit(async ({ name }) => {
        setFailure(null);
        try {
          await onCreate(name);
          reset({ name: '' });
        } catch (error) {
          if (error instanceof ApiError) for (const f of error.fieldErrors) if (f.field === 'name') setError('name', { message: f.message });
          setFailure(error instanceof Error ? error.message : 'Could not create it.');
        }
      })}
    >
      <div className="min-w-64 flex-1">
        <Field id={id} label={label} error={formState.errors.name?.message}>
          <TextInput id={id} autoComplete="off" invalid={!!formState.errors.name} {...register('name')} />
        </Field>
      </div>
      <Button type="submit" disabled={formState.isSubmitting}>{formState.isSubmitting ? 'Creating…' : submitLabel}</Button>
      {failure ? <div className="w-full"><Alert tone="error">{failure}</Alert></div> : null}
    </form>
  );
}
