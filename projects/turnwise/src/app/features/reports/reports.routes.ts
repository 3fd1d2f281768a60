import { Routes } from '@angular/router';
import { BarController, BarElement, CategoryScale, Chart, Legend, LinearScale, Tooltip } from 'chart.js';
import { provideCharts } from 'ng2-charts';

import { Reports } from './reports';

// chart.js is imported only here and below, so it travels in this lazy route's chunk and never
// in the first load; only the bar chart's parts are registered.
// the charts speak in the app's typeface
Chart.defaults.font.family = "'IBM Plex Sans', sans-serif";

export default [
  { path: '', component: Reports, providers: [provideCharts({ registerables: [BarController, BarElement, CategoryScale, LinearScale, Legend, Tooltip] })] },
] satisfies Routes;
