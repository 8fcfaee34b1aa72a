import { it } from 'vitest';
import { buildTestApp } from '../helpers/test-app';
it('diff', async () => {
  const t = await buildTestApp();
  console.log('DIFF>>>', await t.orm.schema.getUpdateSchemaSQL({ wrap: false, safe: true }), '<<<');
  await t.close();
});
