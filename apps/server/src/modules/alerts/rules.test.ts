import { safetyDeferral } from '@lotwise/shared';
import { describe, expect, it } from 'vitest';
import type { AlertContainerFacts, LowStockFacts } from './alerts.repository';
import { defaultKinds, nextDigestAt } from './alerts.service';
import { escapeHtml, topicMessage } from './messages';
import { retryDelaySeconds } from './outbox-worker';
import {
  datedConditions,
  lowStockConditions,
  mailTopics,
  reservationConditions,
  sortConditions,
} from './rules';
import { readUnsubscribeToken, unsubscribeToken } from './unsubscribe-token';

const textStyle = { locale: 'en-GB', timeZone: 'UTC' };

const ethanol: LowStockFacts = {
  id: 3,
  name: 'Ethanol <absolute>',
  stockUnit: 'mL',
  reorderPoint: 1000,
  reorderQuantity: 2500,
  ghsPictograms: ['GHS02', 'GHS07'],
  hazardStatements: ['H225', 'H319'],
  total: 750,
};

function container(overrides: Partial<AlertContainerFacts> = {}): AlertContainerFacts {
  return {
    id: 11,
    labelCode: 'LW-00011',
    chemicalId: 3,
    chemicalName: 'Ethanol <absolute>',
    ghsPictograms: ['GHS02'],
    hazardStatements: ['H225', 'H319'],
    status: 'open',
    quantity: 750,
    unit: 'mL',
    expiresOn: null,
    peroxideDueOn: null,
    locationPath: 'Teaching lab > Flammables cabinet > Shelf 1',
    ...overrides,
  };
}

describe('low-stock rule', () => {
  it('when the usable total is below or at the reorder point, then it raises low-stock; above it, nothing', () => {
    const usable = [container()];
    expect(lowStockConditions([ethanol], usable)).toMatchObject([
      { kind: 'low-stock', severity: 'warning', key: 'low-stock:chemical:3' },
    ]);
    expect(lowStockConditions([{ ...ethanol, total: 1000 }], usable)).toHaveLength(1);
    expect(lowStockConditions([{ ...ethanol, total: 1000.5 }], usable)).toEqual([]);
  });

  it('when nothing usable is left, then it is critical', () => {
    expect(lowStockConditions([{ ...ethanol, total: 0 }], [])[0]).toMatchObject({
      severity: 'critical',
      stock: { containers: [] },
    });
  });
});

describe('dated rules', () => {
  const today = '2026-03-01';
  const until = '2026-03-31';

  it('when a container expires within the window, then expiring; past its date, expired; later, nothing', () => {
    const found = datedConditions(
      [
        container({ id: 1, expiresOn: '2026-03-15' }),
        container({ id: 2, expiresOn: '2026-02-28' }),
        container({ id: 3, expiresOn: '2026-04-01' }),
        container({ id: 4, expiresOn: '2026-03-01' }),
      ],
      today,
      until,
    );
    expect(found.map((c) => [c.key, c.severity])).toEqual([
      ['expiring:container:1', 'info'],
      ['expired:container:2', 'warning'],
      ['expiring:container:4', 'info'],
    ]);
  });

  it('when a peroxide test is due within the window, then warning; overdue, critical', () => {
    const found = datedConditions(
      [
        container({ id: 5, peroxideDueOn: '2026-03-20' }),
        container({ id: 6, peroxideDueOn: '2026-02-01' }),
      ],
      today,
      until,
    );
    expect(found.map((c) => [c.kind, c.severity])).toEqual([
      ['peroxide-due', 'warning'],
      ['peroxide-due', 'critical'],
    ]);
    expect(sortConditions(found)[0]!.container!.id).toBe(6);
  });

  it('when a container is empty or disposed, then no dated rule fires', () => {
    expect(
      datedConditions(
        [
          container({ status: 'empty', expiresOn: '2026-01-01' }),
          container({ status: 'disposed', peroxideDueOn: '2026-01-01' }),
        ],
        today,
        until,
      ),
    ).toEqual([]);
  });
});

describe('reservation rule', () => {
  it('when a reservation lapses soon, then only the person who made it is addressed', () => {
    const [condition] = reservationConditions([
      {
        id: 9,
        planId: 4,
        planTitle: 'Aspirin, 6 benches',
        userId: 21,
        containerId: 11,
        labelCode: 'LW-00011',
        locationPath: 'Prep room',
        chemicalId: 3,
        chemicalName: 'Ethanol',
        ghsPictograms: ['GHS02', 'GHS07'],
        hazardStatements: ['H225', 'H319'],
        quantity: 120,
        unit: 'mL',
        lapsesAt: '2026-03-02T17:00:00.000Z',
      },
    ]);
    expect(condition).toMatchObject({ kind: 'reservation-lapsing', userIds: [21] });
    const [topic] = mailTopics([condition!]);
    const reminder = topicMessage(topic!, 'http://lab.example.test', textStyle);
    expect(reminder.text).toContain('GHS02 (Flammable)');
    expect(reminder.text).toContain('- H225 Highly flammable liquid and vapour.');
    expect(reminder.text).toContain(safetyDeferral);
    expect(topicMessage(topic!, 'http://lab.example.test', textStyle).link).toBe(
      'http://lab.example.test/preparations/plans/4',
    );
  });
});

describe('mail topics', () => {
  it('when several containers of one chemical expire, then one e-mail covers them and its key follows the set', () => {
    const two = datedConditions(
      [
        container({ id: 1, expiresOn: '2026-03-10' }),
        container({ id: 2, expiresOn: '2026-03-12' }),
      ],
      '2026-03-01',
      '2026-03-31',
    );
    const topics = mailTopics(two);
    expect(topics).toHaveLength(1);
    const one = mailTopics(two.slice(0, 1));
    expect(one[0]!.dedupKey).not.toBe(topics[0]!.dedupKey);
    expect(mailTopics(two)[0]!.dedupKey).toBe(topics[0]!.dedupKey);
  });

  it('when low stock turns into no stock, then the key changes so people hear about it', () => {
    const low = mailTopics(lowStockConditions([ethanol], []))[0]!;
    const out = mailTopics(lowStockConditions([{ ...ethanol, total: 0 }], []))[0]!;
    expect(low.dedupKey).toBe('low-stock:chemical:3:warning');
    expect(out.dedupKey).toBe('low-stock:chemical:3:critical');
  });
});

describe('messages', () => {
  it('when low stock is written up, then it names the chemical, amounts with units, containers, places, the link and the hazard line', () => {
    const topic = mailTopics(lowStockConditions([ethanol], [container()]))[0]!;
    const message = topicMessage(topic, 'http://lab.example.test', textStyle);
    expect(message.subject).toBe(
      'Low stock: Ethanol <absolute> — 750.00 mL left (reorder point 1,000.00 mL)',
    );
    expect(message.text).toContain('Usable stock: 750.00 mL');
    expect(message.text).toContain('Reorder point: 1,000.00 mL');
    expect(message.text).toContain(
      'LW-00011 · 750.00 mL · Teaching lab > Flammables cabinet > Shelf 1',
    );
    expect(message.text).toContain('http://lab.example.test/stock/chemicals/3');
    expect(message.text).toContain(safetyDeferral);
    expect(message.text).toContain('GHS02 (Flammable)');
    expect(message.text).toContain('- H225 Highly flammable liquid and vapour.');
    expect(message.html).toContain('<li>H319 Causes serious eye irritation.</li>');
    expect(message.html).toContain('Ethanol &lt;absolute&gt;');
    expect(message.html).not.toContain('<absolute>');
    expect(message.html).not.toMatch(/<img|<style|<script|url\(/i);
  });

  it('when one container is due, then the link opens that container', () => {
    const [topic] = mailTopics(
      datedConditions([container({ expiresOn: '2026-03-10' })], '2026-03-01', '2026-03-31'),
    );
    expect(topicMessage(topic!, 'http://lab.example.test', textStyle).link).toBe(
      'http://lab.example.test/stock/containers/11',
    );
  });

  it('when a chemical has an H-statement Lotwise holds no text for, or none at all, then the e-mail points to the SDS', () => {
    const odd = { ...ethanol, hazardStatements: ['H999'] };
    const message = topicMessage(
      mailTopics(lowStockConditions([odd], [container()]))[0]!,
      'http://lab.example.test',
      textStyle,
    );
    expect(message.text).toContain('- H999 (text not held in Lotwise: see the SDS)');
    const none = { ...ethanol, hazardStatements: [] };
    const bare = topicMessage(
      mailTopics(lowStockConditions([none], [container()]))[0]!,
      'http://lab.example.test',
      textStyle,
    );
    expect(bare.text).toContain('No hazard statements recorded: check the SDS.');
  });

  it('escapes every HTML special character', () => {
    expect(escapeHtml(`<a href="x">'&'</a>`)).toBe(
      '&lt;a href=&quot;x&quot;&gt;&#39;&amp;&#39;&lt;/a&gt;',
    );
  });
});

describe('unsubscribe tokens', () => {
  const secret = 'a-secret-for-tests-only-32-characters!';

  it('when a token is read back, then it names the person and the kind', () => {
    const token = unsubscribeToken(secret, { userId: 7, kind: 'low-stock' });
    expect(readUnsubscribeToken(secret, token)).toEqual({ userId: 7, kind: 'low-stock' });
  });

  it('when any part was changed, or another secret signed it, then it is refused', () => {
    const token = unsubscribeToken(secret, { userId: 7, kind: 'low-stock' });
    const [payload, signature] = token.split('.') as [string, string];
    const otherPayload = Buffer.from(JSON.stringify({ u: 8, k: 'low-stock' })).toString(
      'base64url',
    );
    const flipped =
      signature.slice(0, -2) + (signature.at(-2) === 'A' ? 'B' : 'A') + signature.at(-1);
    expect(readUnsubscribeToken(secret, `${otherPayload}.${signature}`)).toBeNull();
    expect(readUnsubscribeToken(secret, `${payload}.${flipped}`)).toBeNull();
    expect(readUnsubscribeToken('another-secret-of-at-least-32-chars!!', token)).toBeNull();
    expect(readUnsubscribeToken(secret, 'garbage')).toBeNull();
    expect(readUnsubscribeToken(secret, '')).toBeNull();
  });
});

describe('timing', () => {
  it('backs off 30 s, 2 min, 10 min … and stops growing at 6 h', () => {
    expect([1, 2, 3, 4].map(retryDelaySeconds)).toEqual([30, 120, 600, 1800]);
    expect(retryDelaySeconds(50)).toBe(21600);
  });

  it('sends the digest at the next digest hour, never at the moment of queueing', () => {
    const before = new Date(2026, 2, 1, 6, 30);
    expect(nextDigestAt(before, 7)).toEqual(new Date(2026, 2, 1, 7, 0));
    expect(nextDigestAt(new Date(2026, 2, 1, 7, 0), 7)).toEqual(new Date(2026, 2, 2, 7, 0));
  });

  it('gives viewers no alert e-mails by default and everyone else all kinds', () => {
    expect(defaultKinds('viewer')).toEqual([]);
    expect(defaultKinds('member')).toContain('low-stock');
  });
});
