import type { Comparison, SaveComparisonRequest } from '../../shared/schemas/comparison';
import { api } from './http';

export const saveComparison = (req: SaveComparisonRequest) => api<Comparison>('POST', '/comparisons', req);
export const getComparison = (id: number) => api<Comparison>('GET', `/comparisons/${id}`);
export const listComparisons = () => api<{ items: Comparison[] }>('GET', '/comparisons');
