// Every seeder, in order (static list, as for migrations).
import * as s20261201000100 from './20261201000100-demo-sites-and-users';
import * as s20261201000200 from './20261201000200-demo-register';
import * as s20261201000300 from './20261201000300-demo-surveys';
import * as s20261201000400 from './20261201000400-demo-tests';
import * as s20261201000500 from './20261201000500-demo-outcomes';

export const seeders = [
  { name: '20261201000100-demo-sites-and-users', ...s20261201000100 },
  { name: '20261201000200-demo-register', ...s20261201000200 },
  { name: '20261201000300-demo-surveys', ...s20261201000300 },
  { name: '20261201000400-demo-tests', ...s20261201000400 },
  { name: '20261201000500-demo-outcomes', ...s20261201000500 },
];
