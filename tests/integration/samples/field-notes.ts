import type { FIELD_NOTE_ROUTES } from '@/lib/api/field-note-routes';
import type { Sample } from './sample';

export const FIELD_NOTE_SAMPLES: Record<keyof typeof FIELD_NOTE_ROUTES, Sample> = {};
