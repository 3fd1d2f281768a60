export * from './model';
export { proposeDayFit } from './propose';
