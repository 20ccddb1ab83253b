// One home for cycle alignment: the comparison page and the server's comparison report overlay the same way.
export { alignedTraces, envelopeAt, firstRisingCrossing, type AlignedTrace } from '../../shared/reports/alignedCycles';
