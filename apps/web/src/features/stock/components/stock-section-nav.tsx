import { Outlet } from 'react-router';
import {
  BookOpenCheck,
  Boxes,
  FileUp,
  Flame,
  LayoutList,
  MapPin,
  PackagePlus,
  ShieldAlert,
  Tags,
  Trash2,
} from 'lucide-react';
import { can, type Permission } from '@lotwise/shared';
import { useCurrentUser } from '../../../lib/auth';
import { SectionTabs, type SectionTab } from '../../../components/ui/section-tabs';
import { paths } from '../../../config/paths';

interface Section extends SectionTab {
  /** Shown only to roles holding it. */
  permission?: Permission;
}

/** The parts of Stock. CSV export sits on the lists it exports. */
const sections: Section[] = [
  { to: paths.stock, label: 'Overview', icon: LayoutList, end: true },
  { to: paths.stockContainers, label: 'Containers', icon: Boxes },
  { to: paths.stockLocations, label: 'Locations', icon: MapPin },
  { to: paths.stockSegregation, label: 'Storage conflicts', icon: ShieldAlert },
  { to: paths.stockLabAreas, label: 'Lab areas', icon: Flame },
  { to: paths.stockRuleSets, label: 'Rule sets', icon: BookOpenCheck },
  { to: paths.stockWaste, label: 'Waste', icon: Trash2 },
  { to: paths.stockReceive, label: 'Receive', icon: PackagePlus, permission: 'stock.write' },
  { to: paths.stockImport, label: 'Import', icon: FileUp, permission: 'stock.write' },
  { to: paths.stockLabels, label: 'Labels', icon: Tags },
];

export function StockSectionNav() {
  const { data: user } = useCurrentUser();
  const visible = sections.filter(
    (section) =>
      section.permission === undefined || (user ? can(user.role, section.permission) : false),
  );
  return <SectionTabs label="Stock" tabs={visible} />;
}

/** Every stock page sits under the section's own navigation. */
export function StockLayout() {
  return (
    <>
      <StockSectionNav />
      <Outlet />
    </>
  );
}
