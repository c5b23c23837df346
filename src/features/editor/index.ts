// The editor feature's public face: the plot component and its colours, for other features' pictures.
export { Chart, PLOT, axisStyle, baseOption } from './charts/chart';
