import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { API_EXAMPLES, PYTHON_EXAMPLE } from '@/lib/api-examples';

const README = readFileSync(new URL('../../README.md', import.meta.url), 'utf8');

describe('the API examples', () => {
  it('the README holds every example of the API page word for word', () => {
    for (const e of API_EXAMPLES) {
      expect(README, e.task).toContain(`### ${e.task}`);
      expect(README, `${e.task}: curl`).toContain(e.curl);
      expect(README, `${e.task}: R`).toContain(e.r);
    }
    expect(README).toContain(PYTHON_EXAMPLE);
  });

  it('the curl examples send the token as a bearer header and reach the lab API', () => {
    for (const e of API_EXAMPLES) {
      expect(e.curl).toContain('Authorization: Bearer $EPICYCLE_TOKEN');
      expect(e.curl).toMatch(/\/api\/v1\/labs\/[a-z-]+\//);
    }
  });
});
