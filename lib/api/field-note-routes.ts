// Part of the route list (lib/api/routes.ts joins it in): technicians' field notes on traps in a survey.
// The note's input schema lives here too, beside its routes, and the add form uses the same one
// (it would sit in lib/validation/ once that folder takes field notes).
import { z } from 'zod';
import { idSchema } from '@/lib/validation/common';
import type { RouteSpec } from './spec';

/** Kinds a note is written as; "photo" comes only with a photo, through the upload route. */
export const FIELD_NOTE_KIND_LIST = ['not_reachable', 'line_out_of_service', 'insulation_missing', 'photo', 'remark'] as const;
export type FieldNoteKindCode = (typeof FIELD_NOTE_KIND_LIST)[number];
export const WRITTEN_NOTE_KINDS = ['not_reachable', 'line_out_of_service', 'insulation_missing', 'remark'] as const;

export const FIELD_NOTE_KIND_LABELS: Record<FieldNoteKindCode, string> = {
  not_reachable: 'Not reachable',
  line_out_of_service: 'Line out of service',
  insulation_missing: 'Insulation missing',
  photo: 'Photo',
  remark: 'Remark',
};

/** Photos: what a phone or a site camera gives, checked by their first bytes (not the name). */
export const PHOTO_MAX_BYTES = 10 * 1024 * 1024;
export const PHOTO_TYPES = ['image/png', 'image/jpeg', 'image/webp'] as const;

const noteText = z.string().trim().max(2000, 'A note is at most 2,000 characters.');

export const fieldNoteInputSchema = z
  .object({
    kind: z.enum(WRITTEN_NOTE_KINDS, 'Choose what you found: not reachable, line out of service, insulation missing, or a remark.'),
    text: noteText.optional(),
    testId: idSchema.nullable().optional(),
  })
  .refine((n) => n.kind !== 'remark' || (n.text ?? '').length > 0, { path: ['text'], message: 'A remark needs some words.' });
export type FieldNoteInput = z.output<typeof fieldNoteInputSchema>;

/** The text fields of a photo upload (multipart), read after the file part. */
export const fieldPhotoFieldsSchema = z.object({
  kind: z.enum(FIELD_NOTE_KIND_LIST).default('photo'),
  text: noteText.optional(),
  testId: idSchema.nullable().optional(),
});

const fieldNote = z.object({
  id: z.number(), siteId: z.number(), surveyId: z.number(), surveyName: z.string().nullable(), trapId: z.number(), trapTag: z.string().nullable(),
  testId: z.number().nullable(), kind: z.enum(FIELD_NOTE_KIND_LIST), text: z.string().nullable(),
  photo: z.object({ url: z.string(), type: z.string() }).nullable(),
  createdBy: z.string().nullable(), createdById: z.number().nullable(), createdAt: z.string(),
  canDelete: z.boolean().describe('whether the caller may delete it: its author, or an analyst, while the survey is not published'),
});
const noteList = z.object({
  items: z.array(fieldNote),
  canAdd: z.boolean().describe('whether the caller may add notes here (role, and the survey not published)'),
});
const surveyTrapParams = z.object({ surveyId: idSchema, trapId: idSchema });
const surveyNoteParams = z.object({ surveyId: idSchema, noteId: idSchema });

const fieldWorkItem = z.object({
  trapId: z.number(), tag: z.string(), areaName: z.string().nullable(), location: z.string().nullable(), trapType: z.string(),
  pressureBarg: z.number(), tested: z.boolean(), retestPending: z.boolean(), latestTestId: z.number().nullable(),
  standing: z.string().describe('in words: "re-test asked for", "not tested", "not tested: not reachable", "tested"'),
  notes: z.array(fieldNote),
});

export const FIELD_NOTE_ROUTES = {
  createFieldNote: {
    method: 'POST', path: '/api/surveys/{surveyId}/traps/{trapId}/field-notes', permission: 'fieldnote.write', tag: 'Field notes', status: 201,
    summary: 'Add a note to a trap in a survey (not reachable, line out of service, insulation missing, a remark), optionally on one of its tests. "Line out of service" makes the suggested verdict "out of service" once the survey\'s tests are settled again.',
    params: surveyTrapParams, body: fieldNoteInputSchema, response: fieldNote,
  },
  listTrapFieldNotes: {
    method: 'GET', path: '/api/surveys/{surveyId}/traps/{trapId}/field-notes', permission: 'survey.read', tag: 'Field notes',
    summary: 'The notes on a trap in a survey, newest first.', params: surveyTrapParams, response: noteList,
  },
  uploadFieldNotePhoto: {
    method: 'POST', path: '/api/surveys/{surveyId}/traps/{trapId}/field-notes/photo', permission: 'fieldnote.write', tag: 'Field notes', status: 201,
    summary: 'Add a photo to a trap in a survey as multipart/form-data: one part "photo" (PNG, JPEG or WebP, at most 10 MB; checked by its bytes), and optional fields "text", "testId" and "kind" (default photo).',
    params: surveyTrapParams, response: fieldNote,
  },
  listTestFieldNotes: {
    method: 'GET', path: '/api/tests/{testId}/field-notes', permission: 'survey.read', tag: 'Field notes',
    summary: 'The notes made on one test, newest first.', params: z.object({ testId: idSchema }), response: noteList,
  },
  listTrapNotesAcrossSurveys: {
    method: 'GET', path: '/api/traps/{trapId}/field-notes', permission: 'survey.read', tag: 'Field notes',
    summary: 'Every note on a trap across its site\'s surveys, newest first.', params: z.object({ trapId: idSchema }), response: noteList,
  },
  getFieldNotePhoto: {
    method: 'GET', path: '/api/surveys/{surveyId}/field-notes/{noteId}/photo', permission: 'survey.read', tag: 'Field notes',
    summary: "A note's photo, as stored (image/png, image/jpeg or image/webp).", params: surveyNoteParams,
  },
  deleteFieldNote: {
    method: 'DELETE', path: '/api/surveys/{surveyId}/field-notes/{noteId}', permission: 'fieldnote.write', tag: 'Field notes',
    summary: 'Delete a note: its author, or an analyst, while the survey is not published.',
    params: surveyNoteParams, response: z.object({ deleted: z.number() }),
  },
  fieldWork: {
    method: 'GET', path: '/api/surveys/{surveyId}/field-work', permission: 'survey.read', tag: 'Field notes',
    summary: 'The field list of a survey: traps with a re-test asked for, traps in service not tested yet, and traps with notes.',
    params: z.object({ surveyId: idSchema }),
    response: z.object({
      items: z.array(fieldWorkItem), canAdd: z.boolean(),
      counts: z.object({ retestPending: z.number(), untested: z.number(), withNotes: z.number() }),
    }),
  },
} as const satisfies Record<string, RouteSpec>;
