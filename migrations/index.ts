// Every migration, in order. umzug takes this static list: a glob of .ts files fails under vitest.
import * as m20261201000100 from './20261201000100-create-users-sites-memberships';
import * as m20261201000200 from './20261201000200-create-areas-traps';
import * as m20261201000300 from './20261201000300-create-surveys';
import * as m20261201000400 from './20261201000400-create-api-tokens';
import * as m20261201000500 from './20261201000500-create-audit-events-sign-in-attempts';
import * as m20261201010000 from './20261201010000-create-import-tables';
import * as m20261201020000 from './20261201020000-create-trap-verdicts';
import * as m20261201030000 from './20261201030000-create-outcome-tables';
import * as m20261201070000 from './20261201070000-add-test-list-indexes';
import * as m20261201080000 from './20261201080000-add-test-loss-mode';
import * as m20261201090000 from './20261201090000-add-upload-claims';
import * as m20261201100000 from './20261201100000-add-survey-read-indexes';
import * as m20261201100100 from './20261201100100-count-test-writes';
import * as m20261202090000 from './20261202090000-count-writes-by-subject';
import * as m20261202090100 from './20261202090100-one-active-work-order';

export const migrations = [
  { name: '20261201000100-create-users-sites-memberships', ...m20261201000100 },
  { name: '20261201000200-create-areas-traps', ...m20261201000200 },
  { name: '20261201000300-create-surveys', ...m20261201000300 },
  { name: '20261201000400-create-api-tokens', ...m20261201000400 },
  { name: '20261201000500-create-audit-events-sign-in-attempts', ...m20261201000500 },
  { name: '20261201010000-create-import-tables', ...m20261201010000 },
  { name: '20261201020000-create-trap-verdicts', ...m20261201020000 },
  { name: '20261201030000-create-outcome-tables', ...m20261201030000 },
  { name: '20261201070000-add-test-list-indexes', ...m20261201070000 },
  { name: '20261201080000-add-test-loss-mode', ...m20261201080000 },
  { name: '20261201090000-add-upload-claims', ...m20261201090000 },
  { name: '20261201100000-add-survey-read-indexes', ...m20261201100000 },
  { name: '20261201100100-count-test-writes', ...m20261201100100 },
  { name: '20261202090000-count-writes-by-subject', ...m20261202090000 },
  { name: '20261202090100-one-active-work-order', ...m20261202090100 },
];
