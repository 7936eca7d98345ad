import { leaveTo } from './leave-to';
import { useState } from 'react';
import type { FieldPath } from 'react-hook-form';
import type { DayKind, DayKindFormValues } from '../../shared/schemas/profile-settings';
import { ApiError } from '../api/client';
import { useActiveProfile } from '../api/auth';
import { useDayKinds, useDeleteDayKind, useSaveDayKind } from '../api/profile-settings';
import { Button } from '../ui/button';
import { applyServerErrors } from '../ui/form-errors';
import { Screen } from '../ui/screen';
import { ErrorState, LoadingState } from '../ui/states';
import { DayKindForm } from './day-kind-form';

function defaults(kind: DayKind | undefined, glucoseUnit: DayKind['glucoseUnit'], first: boolean): DayKindFormValues {
  if (!kind) {
    return { name: '', isDefault: first, longActingUnits: '', glucoseUnit, timesOfDay: [{ from: '00:00', to: '24:00', carbRatio: '', correctionFactor: '' }] };
  }
  return {
    name: kind.name,
    isDefault: kind.isDefault,
    longActingUnits: kind.longActingUnits == null ? '' : String(kind.longActingUnits),
    glucoseUnit,
    timesOfDay: kind.timesOfDay.map((b) => ({ from: b.from, to: b.to, carbRatio: String(b.carbRatio), correctionFactor: String(b.correctionFactor) })),
  };
}

/** Settings → a new day kind, or editing one (id "new" for a new one). */
export function DayKindEditorScreen({ id }: { id: string }) {
  const { profile } = useActiveProfile();
  const kinds = useDayKinds(profile?.id);
  const dayKindId = id === 'new' ? null : Number(id);
  const save = useSaveDayKind(profile?.id ?? 0, dayKindId);
  const remove = useDeleteDayKind(profile?.id ?? 0);
  const [formError, setFormError] = useState<string>();
  const [confirming, setConfirming] = useState(false);
  if (!profile || kinds.isPending) return <LoadingState />;
  if (kinds.isError) return <ErrorState error={kinds.error} onRetry={() => void kinds.refetch()} />;
  const kind = dayKindId ? kinds.data.find((k) => k.id === dayKindId) : undefined;
  if (dayKindId && !kind) return <ErrorState error={new ApiError(404, 'not_found', 'That day kind was not found.')} />;
  const values = defaults(kind, profile.glucoseUnit, kinds.data.length === 0);
  const fields = (timeOfDayCount: number): FieldPath<DayKindFormValues>[] => [
    'name',
    'isDefault',
    'longActingUnits',
    ...Array.from({ length: timeOfDayCount }).flatMap((_, i) =>
      ['from', 'to', 'carbRatio', 'correctionFactor'].map((f) => `timesOfDay.${i}.${f}` as FieldPath<DayKindFormValues>),
    ),
  ];
  return (
    <Screen title={kind ? `Edit ${kind.name}` : 'New day kind'} subtitle={`For ${profile.displayName}`} backHref="/settings/day-kinds">
      <DayKindForm
        key={kind?.updatedAt ?? 'new'}
        defaultValues={values}
        submitLabel={kind ? 'Save day kind' : 'Add day kind'}
        submitting={save.isPending}
        formError={formError}
        onSubmit={(input, form) => {
          setFormError(undefined);
          save.mutate(input, {
            onSuccess: () => leaveTo('/settings/day-kinds'),
            onError: (error) => setFormError(applyServerErrors(error, form.setError, fields(input.timesOfDay.length))),
          });
        }}
      />
      {kind ? (
        <Button
          variant="danger"
          label={confirming ? `Yes, delete ${kind.name} and its ratios` : `Delete ${kind.name}`}
          loading={remove.isPending}
          onPress={() =>
            !confirming
              ? setConfirming(true)
              : remove.mutate(kind.id, {
                  onSuccess: () => leaveTo('/settings/day-kinds'),
                  onError: (error) => setFormError(error instanceof ApiError ? error.message : 'Could not delete.'),
                })
          }
        />
      ) : null}
    </Screen>
  );
}
