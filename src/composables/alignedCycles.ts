export { firstRisingCrossing, valueAt } from '../../shared/reports/alignedCycles';
