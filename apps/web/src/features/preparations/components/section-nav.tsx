import { Outlet } from 'react-router';
import { ClipboardList, FlaskRound, NotebookPen } from 'lucide-react';
import { SectionTabs, type SectionTab } from '../../../components/ui/section-tabs';
import { paths } from '../../../config/paths';

const sections: SectionTab[] = [
  { to: paths.procedures, label: 'Procedures', icon: NotebookPen },
  { to: paths.plans, label: 'Session plans', icon: ClipboardList },
  { to: paths.runs, label: 'Runs', icon: FlaskRound },
];

export function PreparationsSectionNav() {
  return <SectionTabs label="Preparations" tabs={sections} />;
}

/** Every preparations page sits under the section's own navigation. */
export function PreparationsLayout() {
  return (
    <>
      <PreparationsSectionNav />
      <Outlet />
    </>
  );
}
