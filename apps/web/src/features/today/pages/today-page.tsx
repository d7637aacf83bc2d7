import type { ReactNode } from 'react';
import {
  CalendarClock,
  ClipboardList,
  Flame,
  FlaskRound,
  MailWarning,
  PackageMinus,
  ShieldAlert,
  ShoppingCart,
  TestTubeDiagonal,
} from 'lucide-react';
import { todaySectionKeys, type Today, type TodaySectionKey } from '@lotwise/shared';
import { SafetyCaution } from '../../../components/hazards/safety-caution';
import { ErrorState } from '../../../components/ui/error-state';
import { PageSpinner } from '../../../components/ui/spinner';
import { formatDate } from '../../../lib/format';
import { useToday } from '../api';
import { TodaySectionCard } from '../components/today-section-card';

interface SectionText {
  title: string;
  icon: ReactNode;
  /** What an empty section says: all is well. */
  allWell: (today: Today) => string;
  /** The link to the full list when every item is shown. */
  moreLabel: string;
}

const sectionTexts: Record<TodaySectionKey, SectionText> = {
  belowReorderPoint: {
    title: 'Below reorder point',
    icon: <PackageMinus aria-hidden="true" />,
    allWell: () => 'Nothing below its reorder point.',
    moreLabel: 'All stock alerts',
  },
  expiry: {
    title: 'Expired and expiring',
    icon: <CalendarClock aria-hidden="true" />,
    allWell: (today) =>
      `Nothing expired, and nothing expires in the next ${today.expiryWindowDays} days.`,
    moreLabel: 'All stock alerts',
  },
  peroxideDue: {
    title: 'Peroxide tests due',
    icon: <TestTubeDiagonal aria-hidden="true" />,
    allWell: (today) => `No peroxide test is due in the next ${today.expiryWindowDays} days.`,
    moreLabel: 'All stock alerts',
  },
  plans: {
    title: 'Sessions today and this week',
    icon: <ClipboardList aria-hidden="true" />,
    allWell: (today) => `No session is planned from today to ${formatDate(today.weekEnd)}.`,
    moreLabel: 'All plans',
  },
  myOpenRuns: {
    title: 'My runs still open',
    icon: <FlaskRound aria-hidden="true" />,
    allWell: () => 'None of your runs is waiting to be recorded.',
    moreLabel: 'All runs',
  },
  storageConflicts: {
    title: 'Storage conflicts',
    icon: <ShieldAlert aria-hidden="true" />,
    allWell: () => 'Every place holds only what may be stored together.',
    moreLabel: 'Storage check',
  },
  labAreaLimits: {
    title: 'Lab areas near a flammable-liquid limit',
    icon: <Flame aria-hidden="true" />,
    allWell: () => 'Every lab area holds well within its flammable-liquid limits.',
    moreLabel: 'All lab areas',
  },
  failedEmails: {
    title: 'E-mails not sent',
    icon: <MailWarning aria-hidden="true" />,
    allWell: () => 'Every e-mail went out.',
    moreLabel: 'Outbox',
  },
  ordersWaiting: {
    title: 'Shared orders waiting for you',
    icon: <ShoppingCart aria-hidden="true" />,
    allWell: () => 'No shared order needs anything from you.',
    moreLabel: 'My purchases',
  },
};

/** "Thursday, 3 December 2026" in the reader's locale; the date is the server's today. */
function longDate(isoDate: string): string {
  return new Intl.DateTimeFormat(undefined, { dateStyle: 'full', timeZone: 'UTC' }).format(
    new Date(`${isoDate}T00:00:00.000Z`),
  );
}

/** The start page: what needs doing today, for the signed-in person's role. */
export function TodayPage() {
  const today = useToday();

  return (
    <div className="flex flex-col gap-4">
      <div>
        <h1 className="text-xl font-semibold text-ink-900">Today</h1>
        <p className="text-sm text-ink-600">
          {today.data ? `${longDate(today.data.date)}. ` : ''}What needs doing, as it stands right
          now.
        </p>
      </div>

      {today.isPending ? (
        <PageSpinner label="Gathering what needs doing…" />
      ) : today.isError ? (
        <ErrorState
          title="The start page could not be loaded"
          error={today.error}
          onRetry={() => void today.refetch()}
        />
      ) : (
        <>
          {/* Columns rather than a grid: cards of different lengths pack without gaps. */}
          <div className="columns-1 gap-4 lg:columns-2 2xl:columns-3">
            {todaySectionKeys.map((key) => {
              const section = today.data.sections[key];
              if (!section) return null;
              const text = sectionTexts[key];
              return (
                <TodaySectionCard
                  key={key}
                  id={key}
                  title={text.title}
                  icon={text.icon}
                  section={section}
                  allWell={text.allWell(today.data)}
                  moreLabel={text.moreLabel}
                />
              );
            })}
          </div>
          <SafetyCaution />
        </>
      )}
    </div>
  );
}
