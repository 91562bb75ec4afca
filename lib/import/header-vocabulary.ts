/**
 * Words that header cells, preamble keys and role values use for each field,
 * in English, German, French, Spanish and Dutch. Plain dictionary words of the
 * five languages, written for Plumeward; matching is on normalised tokens
 * (lower case, accents stripped), so `Température` and `temperature` agree.
 */

export type FieldKind = 'time' | 'date' | 'index' | 'level' | 'temperature' | 'tag' | 'role';

/** Lower case, accents stripped, µ/° kept (they carry units), blanks folded. */
export function normaliseWord(text: string): string {
  return text
    .normalize('NFD')
    .replace(/[\u0300-\u036f]/g, '')
    .replace(/μ/g, 'µ')
    .toLowerCase()
    .replace(/\s+/g, ' ')
    .trim();
}

/** Tokens of a header cell: letters and digits runs, units inside brackets included. */
export function wordsOf(text: string): string[] {
  return normaliseWord(text)
    .split(/[^a-z0-9µ°]+/)
    .filter(Boolean);
}

const VOCABULARY: Record<FieldKind, { words: string[]; phrases: string[] }> = {
  time: {
    words: [
      'time', 'timestamp', 'datetime', 'when', 'elapsed', 'seconds', 'secs', 'epoch', 'unix', 'clock',
      'zeit', 'zeitpunkt', 'zeitstempel', 'uhrzeit', 'sekunden', 'dauer',
      'heure', 'horodatage', 'temps', 'secondes',
      'hora', 'tiempo', 'instante', 'segundos',
      'tijd', 'tijdstip', 'tijdstempel', 'seconden',
    ],
    phrases: ['date time', 'date heure', 'fecha hora', 'marca de tiempo', 'datum tijd', 'datum uhrzeit'],
  },
  date: { words: ['date', 'datum', 'fecha', 'day'], phrases: [] },
  index: {
    words: ['sample', 'samples', 'index', 'idx', 'nr', 'no', 'num', 'count', 'probe', 'messung', 'echantillon', 'muestra', 'monster', 'meting'],
    phrases: ['sample no', 'sample number', 'lfd nr', 'n°'],
  },
  level: {
    words: [
      'level', 'sound', 'ultrasound', 'ultrasonic', 'signal', 'db', 'dbuv', 'dbµv', 'rms', 'amplitude', 'noise', 'voltage', 'volt', 'mv',
      'pegel', 'schall', 'schallpegel', 'ultraschall', 'spannung', 'gerausch',
      'niveau', 'son', 'sonore', 'ultrason', 'tension', 'bruit',
      'nivel', 'sonido', 'ultrasonido', 'senal', 'ruido', 'voltaje',
      'geluid', 'geluidsniveau', 'ultrageluid', 'signaal', 'spanning',
    ],
    phrases: ['sound level', 'signal level', 'niveau sonore', 'nivel sonoro'],
  },
  temperature: {
    words: ['temperature', 'temp', 'surface', 'surf', 'temperatur', 'oberflache', 'oberflachentemperatur', 'temperatura', 'temperatuur', 'oppervlak', 'oppervlakte', 'superficie', '°c', '°f', 'degc', 'degf'],
    phrases: ['surface temp', 'surface temperature'],
  },
  tag: {
    words: [
      'tag', 'trap', 'point', 'id', 'location', 'label', 'asset',
      'messstelle', 'messpunkt', 'kennung', 'ableiter', 'bezeichnung', 'stelle',
      'repere', 'purgeur', 'emplacement', 'etiquette',
      'etiqueta', 'punto', 'purgador', 'identificador', 'ubicacion',
      'meetpunt', 'condenspot', 'kenmerk', 'plaats',
    ],
    phrases: ['test point', 'measuring point', 'point de mesure', 'punto de medida', 'trap tag'],
  },
  role: {
    words: ['role', 'position', 'kind', 'rolle', 'art', 'typ', 'messort', 'rol', 'tipo', 'soort', 'type'],
    phrases: ['point role', 'point type', 'type de point', 'tipo de punto', 'soort punt', 'punkt art', 'punktart'],
  },
};

/**
 * How strongly a header cell names each kind, 0..1. Phrases count more than
 * single words; the role words are weaker alone because `type` is common.
 */
export function nameScores(header: string): Record<FieldKind, number> {
  const norm = normaliseWord(header).replace(/[^a-z0-9µ° ]+/g, ' ').replace(/\s+/g, ' ');
  const words = new Set(wordsOf(header));
  const out = {} as Record<FieldKind, number>;
  for (const kind of Object.keys(VOCABULARY) as FieldKind[]) {
    const v = VOCABULARY[kind];
    let s = 0;
    for (const p of v.phrases) if (` ${norm} `.includes(` ${p} `)) s = Math.max(s, 0.9);
    for (const w of v.words) if (words.has(w)) s = Math.max(s, kind === 'role' ? 0.5 : 0.7);
    out[kind] = s;
  }
  // `Punkt`/`point` with a role word is a role column, not a tag column.
  if (out.role >= 0.5 && out.tag > 0 && (words.has('type') || words.has('role') || words.has('rolle') || words.has('art') || words.has('tipo') || words.has('soort') || words.has('rol'))) out.tag *= 0.5;
  return out;
}

/** Values a point-role column or key uses for the trap point. */
export const TRAP_ROLE_WORDS = ['trap', 't', 'steam trap', 'main', 'ableiter', 'kondensatableiter', 'kol', 'purgeur', 'purgador', 'trampa', 'condenspot', 'pot', 'test'];
/** Values for the reference point on the adjacent pipe. */
export const REFERENCE_ROLE_WORDS = [
  'ref', 'reference', 'pipe', 'line', 'upstream', 'r', 'p',
  'referenz', 'rohr', 'leitung', 'vorlauf',
  'tuyau', 'conduite', 'tuyauterie', 'amont',
  'referencia', 'tubo', 'tuberia', 'linea',
  'referentie', 'leiding', 'pijp', 'buis',
];

export type RoleWord = 'trap' | 'reference' | null;

export function roleOfWord(value: string): RoleWord {
  const v = normaliseWord(value);
  if (TRAP_ROLE_WORDS.includes(v)) return 'trap';
  if (REFERENCE_ROLE_WORDS.includes(v)) return 'reference';
  return null;
}

/** Preamble keys naming a start time, a sample rate or interval, a tag, a role, a linked trap. */
export const PREAMBLE_KEY_WORDS = {
  start: ['start', 'started', 'begin', 'beginn', 'startzeit', 'debut', 'inicio', 'comienzo', 'starttijd', 'aanvang'],
  rate: ['rate', 'frequency', 'abtastrate', 'rate hz', 'frequence', 'frecuencia', 'samplefrequentie', 'frequentie', 'hz'],
  interval: ['interval', 'intervall', 'intervalle', 'intervalo', 'period', 'periode'],
  tag: VOCABULARY.tag.words,
  role: [...VOCABULARY.role.words, 'punkt'],
  link: ['linked', 'belongs', 'for', 'zu', 'gehort', 'associe', 'associee', 'asociado', 'hoort', 'bij', 'of'],
};

export function keyHasWord(key: string, words: readonly string[]): boolean {
  const ws = wordsOf(key);
  return ws.some((w) => words.includes(w));
}
