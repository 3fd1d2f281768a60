/**
 * The exam-list file format: columns, parsing rules, row errors and re-import differences.
 * Framework-free, so the Import screen and the server read files by the same rules.
 *
 * @example
 * import { parseExamTable, diffExamLists, EXAM_LIST_COLUMNS } from '../shared/exam-list';
 */
export {
  CONTRAST_SPELLINGS,
  EXAM_LIST_COLUMNS,
  EXAM_LIST_LIMITS,
  MOBILITIES,
  PRECAUTIONS,
  findColumn,
  normaliseHeader,
  type ExamListColumn,
  type ExamListColumnDefinition,
  type Mobility,
  type Precaution,
} from './columns';
export { diffExamLists, type ExamListDiff, type ExamListKeyed } from './diff';
export { columnLetter, readHeader, type ExamListHeader } from './header';
export type { ExamListIssue, ExamListOptions, ExamListResult, ExamListRow } from './model';
export { EXAM_FILE_LIMITS } from './file-limits';
export { parseExamTable } from './parse-rows';
export type { ExamListCells } from './row-cells';
export { resolveStart, type StartResolution } from './start-time';
