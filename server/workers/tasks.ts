/**
 * Everything a worker thread can run, by name (`pool.run(input, { name })`). Each task is a
 * plain async function of structured-clonable data.
 */
export { readExamListTask } from './exam-list-task';
