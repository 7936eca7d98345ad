import { ZxcvbnFactory } from '@zxcvbn-ts/core';
import { adjacencyGraphs, dictionary } from '@zxcvbn-ts/language-common';
import type { PasswordEstimator } from './password';

/** zxcvbn-ts with its common-password and word dictionaries and keyboard graphs, all shipped with the package. */
export function createPasswordEstimator(): PasswordEstimator {
  return new ZxcvbnFactory({ dictionary, graphs: adjacencyGraphs });
}
