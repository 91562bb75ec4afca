import type { WORK_ORDER_ROUTES } from '@/lib/api/work-order-routes';
import type { Sample } from './sample';

export const WORK_ORDER_SAMPLES: Record<keyof typeof WORK_ORDER_ROUTES, Sample> = {};
