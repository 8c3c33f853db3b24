export { CAUTIONS, cautionsText } from './cautions.js';
export { writeFileAtomic, writeFilesAtomic } from './atomic-write.js';
export { rulesJsonText, toRulesJson, RULES_JSON_FORMAT, RULES_JSON_VERSION } from './rules-json.js';
export type { RulesJsonDocument, RuleJson } from './rules-json.js';
export { rulesCsvText } from './rules-csv.js';
export { rulesMdText } from './rules-md.js';
export { summaryText } from './summary.js';
export type { SummaryOptions } from './summary.js';
export { writeRunFolder } from './write-run-folder.js';
