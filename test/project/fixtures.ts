/** Paths of the project-file fixtures and a helper that returns the error a file gives. */
import { fileURLToPath } from 'node:url';
import { expect } from 'vitest';
import { ProjectError } from '../../src/project/index.js';

export const fixture = (name: string): string =>
  fileURLToPath(new URL(`../fixtures/projects/${name}`, import.meta.url));

/** The ProjectError that `load` throws; fails the test when it returns instead. */
export function projectErrorOf(load: () => unknown): ProjectError {
  try {
    load();
  } catch (error) {
    expect(error).toBeInstanceOf(ProjectError);
    return error as ProjectError;
  }
  throw new Error('expected a ProjectError, but the project loaded');
}
