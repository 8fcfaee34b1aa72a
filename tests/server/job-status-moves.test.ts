import { describe, expect, it } from 'vitest';
import { JOB_STATUS_MOVES } from '../../client/src/lib/job-records';
import { TRANSITIONS } from '../../server/src/modules/jobs/job.service';

describe('job status moves', () => {
  it('the buttons the client offers are exactly the moves the server allows', () => {
    expect(JOB_STATUS_MOVES).toEqual(TRANSITIONS);
  });
});
