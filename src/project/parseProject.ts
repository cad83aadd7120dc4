import { locate } from './locate.js';
import { formatKeyPath } from './keyPath.js';
import { normalizeProject } from './normalizeProject.js';
import { ProjectError, type IssueDraft } from './projectError.js';
import { readYamlDocument, type YamlSource } from './readYamlDocument.js';
import type { Project } from './types.js';
import { validateSchema } from './validateSchema.js';

/**
 * Read the text of a project file (YAML, model.md version 1) into a normalized `Project` in SI
 * base units, or throw a ProjectError listing every problem as `FILE:LINE:COL: key.path: message`.
 *
 * Method: three passes, each reporting all it finds before the next runs: YAML parsing with
 * safety checks (`readYamlDocument`), JSON Schema 2020-12 validation (`validateSchema`,
 * schemas/project.schema.json), then quantities, defaults and cross-key rules
 * (`normalizeProject`). Positions come from the YAML node tree.
 *
 * Syntax: parseProject(text, file)
 * Example: parseProject('pwm: { frequency: 20 kHz, high: 3.3 V }\nfilter: { stages: [{ r: 4k7, c: 100n }] }\n', 'p.yaml')
 *          // { file: 'p.yaml', pwm: { frequency: 20000, high: 3.3, low: 0, ... }, filter: { stages: [{ r: 4700, c: 1e-7, buffered: false }] }, ... }
 */
export function parseProject(text: string, file: string): Project {
  const source = readYamlDocument(text, file);
  const schemaIssues = validateSchema(source.data);
  if (schemaIssues.length > 0) throw positioned(source, schemaIssues);
  const { project, issues } = normalizeProject(source.data, file);
  if (!project || issues.length > 0) throw positioned(source, issues);
  return project;
}

function positioned(source: YamlSource, drafts: IssueDraft[]): ProjectError {
  return new ProjectError(
    drafts.map((draft) => {
      const { line, column } = locate(source.doc, source.lineCounter, draft.path, draft.at ?? 'value');
      return { file: source.file, path: formatKeyPath(draft.path), line, column, message: draft.message };
    }),
  );
}
