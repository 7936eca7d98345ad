import { leaveTo } from './leave-to';
import { useState } from 'react';
import { DEFAULT_EXERCISE_REDUCTIONS } from '../../shared/compute/exercise';
import { glucoseFromMmol } from '../../shared/compute/units';
import { DEFAULT_HYPO_THRESHOLD_MMOL, DEFAULT_VERY_HIGH_MMOL, type ProfileSettingsFormValues, type ProfileSettingsView } from '../../shared/schemas/profile-settings';
import { useActiveProfile } from '../api/auth';
import { useProfileSettings, useUpdateSettings } from '../api/profile-settings';
import { Callout } from '../ui/callout';
import { applyServerErrors } from '../ui/form-errors';
import { Screen } from '../ui/screen';
import { ErrorState, LoadingState } from '../ui/states';
import { SETTINGS_FIELDS, UnitsSafetyForm } from './units-safety-form';

const str = (n: number | null | undefined) => (n == null ? '' : String(n));

function formDefaults(view: ProfileSettingsView): ProfileSettingsFormValues {
  const s = view.settings;
  const u = view.glucoseUnit;
  const g = (mmol: number) => String(u === 'mmol_l' ? mmol : Math.round(glucoseFromMmol(mmol, u)));
  const table = s?.exerciseReductions ?? DEFAULT_EXERCISE_REDUCTIONS;
  return {
    glucoseUnit: u,
    carbBasis: view.carbBasis,
    carbUnit: view.carbUnit,
    preferredFoodTable: view.preferredFoodTable,
    timeZone: view.timeZone,
    penIncrement: s?.penIncrement ?? null,
    rounding: s?.rounding ?? 'down',
    maxDoseUnits: str(s?.maxDoseUnits),
    actionTimeHours: str(s?.actionTimeHours),
    activeInsulinModel: s?.activeInsulinModel ?? 'linear',
    targetLow: str(s?.targetLow),
    targetHigh: str(s?.targetHigh),
    correctionTarget: str(s?.correctionTarget),
    hypoThreshold: s ? str(s.hypoThreshold) : g(DEFAULT_HYPO_THRESHOLD_MMOL),
    veryHigh: s ? str(s.veryHigh) : g(DEFAULT_VERY_HIGH_MMOL),
    allowNegativeCorrection: s?.allowNegativeCorrection ?? false,
    iobConvention: s?.iobConvention ?? 'correction_only',
    exerciseReductions: {
      light: { min30: str(table.light.min30), min60: str(table.light.min60) },
      moderate: { min30: str(table.moderate.min30), min60: str(table.moderate.min60) },
      hard: { min30: str(table.hard.min30), min60: str(table.hard.min60) },
    },
  };
}

/** Settings → units and safety limits. */
export function UnitsSafetyScreen() {
  const { profile } = useActiveProfile();
  const settings = useProfileSettings(profile?.id);
  const save = useUpdateSettings(profile?.id ?? 0);
  const [formError, setFormError] = useState<string>();
  if (!profile || settings.isPending) return <LoadingState />;
  if (settings.isError) return <ErrorState error={settings.error} onRetry={() => void settings.refetch()} />;
  return (
    <Screen title="Units and safety limits" subtitle={`For ${profile.displayName}`} backHref="/settings">
      <Callout tone="info" title="From your diabetes team">
        Enter the numbers your diabetes team gave you. Nothing here is suggested for you except the published low-glucose
        alert value and the exercise table, which you can change.
      </Callout>
      <UnitsSafetyForm
        defaultValues={formDefaults(settings.data)}
        submitting={save.isPending}
        formError={formError}
        onSubmit={(values, form) => {
          setFormError(undefined);
          save.mutate(values, {
            onSuccess: () => leaveTo('/settings'),
            onError: (error) => setFormError(applyServerErrors(error, form.setError, SETTINGS_FIELDS)),
          });
        }}
      />
    </Screen>
  );
}
