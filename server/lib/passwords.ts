import { installPasswordEstimator } from '../../shared/compute/password';
import { createPasswordEstimator } from '../../shared/compute/password-estimator';

// The server always checks new passwords against the common dictionaries: every server module that checks one
// (the services, and through them the routes that validate the shared schemas) imports it from here.
installPasswordEstimator(createPasswordEstimator());

export { passwordProblem, utf8Bytes, PASSWORD_MAX_BYTES } from '../../shared/compute/password';
