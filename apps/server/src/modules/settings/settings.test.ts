import { publicSettingsSchema } from '@lotwise/shared';
import request from 'supertest';
import { describe, expect, it } from 'vitest';
import { testContext } from '../../test/harness';

describe('public settings', () => {
  it('when anyone asks, then the lab’s public address is answered without signing in', async () => {
    const { app, config } = testContext();
    const response = await request(app).get('/api/settings/public').expect(200);
    expect(publicSettingsSchema.parse(response.body)).toEqual({ publicUrl: config.publicUrl });
    expect(response.body.publicUrl).toBe('http://lotwise.example.test');
  });
});
