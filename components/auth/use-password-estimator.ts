import { useEffect } from 'react';
import { installPasswordEstimator } from '../../shared/compute/password';

let loading: Promise<void> | undefined;

/** Loads and installs the common-password check once (its own chunk); resolves when the forms use it. */
export function loadPasswordEstimator(): Promise<void> {
  loading ??= import('../../shared/compute/password-estimator')
    .then((m) => installPasswordEstimator(m.createPasswordEstimator()))
    .catch((err: unknown) => {
      loading = undefined;
      throw err;
    });
  return loading;
}

/**
 * Loads the common-password check on a screen that sets a password: zxcvbn's dictionaries (about 470 KB) are a
 * chunk of their own, not part of the first screen. Until they arrive the server's check, which is always made,
 * refuses a common password and the form shows its answer under the field.
 */
export function usePasswordEstimator(): void {
  useEffect(() => {
    loadPasswordEstimator().catch(() => undefined);
  }, []);
}
