// The editor feature's public face: the plot component and its colours, for other features' pictures.
export { Chart, PLOT, axisStyle, baseOption } from './charts/chart';
/** Purity as the totals card writes it ("> 99.99", never "100.00" unless nothing else is in the solid). */
export { formatPurity } from './components/purge-view';
