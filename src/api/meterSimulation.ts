import type { MeterSimulationRequest, MeterSimulationResponse } from '../../shared/schemas/meterSimulation';
import { api } from './http';

export const simulateMeter = (captureId: number, req: MeterSimulationRequest) => api<MeterSimulationResponse>('POST', `/captures/${captureId}/meter-simulation`, req);
