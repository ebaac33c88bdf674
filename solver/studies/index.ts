// Studies over a solve: loading (conductors, breakers), voltage drop and bonds.
export { loadingStudy, loadingStudyOf, LOADING_STUDY_NOTES } from './loading-study';
export type * from './types';
