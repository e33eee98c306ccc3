import type { LucideIcon } from 'lucide-react';
import { Home, Ruler, Users, Mail } from 'lucide-react';
import { HeartHandshake, MapPin, ScanLine } from 'lucide-react';
import { ClipboardList, HandHeart, Layers, Waypoints } from 'lucide-react';
import { CalendarClock } from 'lucide-react';
import { Truck } from 'lucide-react';
import { Gauge } from 'lucide-react';
import type { Role } from '@shared/schemas/user';

export interface NavItem {
  to: string;
  label: string;
  icon: LucideIcon;
  roles: Role[];
}

/** The main navigation, per role. Each area adds its own entries. */
export const navItems: NavItem[] = [
  { to: '/home', label: 'Home', icon: Home, roles: ['volunteer', 'organiser', 'coordinator'] },
  { to: '/planner', label: 'Planner', icon: Ruler, roles: ['volunteer', 'organiser', 'coordinator'] },
  { to: '/drive', label: 'At a glance', icon: Gauge, roles: ['organiser', 'coordinator'] },
  { to: '/needs', label: 'What’s needed', icon: HandHeart, roles: ['volunteer', 'organiser', 'coordinator'] },
  { to: '/pledges', label: 'My pledges', icon: ClipboardList, roles: ['volunteer'] },
  { to: '/blankets', label: 'My blankets', icon: Layers, roles: ['volunteer'] },
  { to: '/drop-off', label: 'Drop-off', icon: CalendarClock, roles: ['volunteer'] },
  { to: '/organiser/intake', label: 'Intake', icon: ScanLine, roles: ['organiser', 'coordinator'] },
  { to: '/organiser/assign', label: 'Assign', icon: Waypoints, roles: ['organiser', 'coordinator'] },
  { to: '/organiser/drop-offs', label: 'Drop-off day', icon: CalendarClock, roles: ['organiser', 'coordinator'] },
  { to: '/all-blankets', label: 'Blankets', icon: Layers, roles: ['organiser', 'coordinator'] },
  { to: '/runs', label: 'Delivery runs', icon: Truck, roles: ['organiser', 'coordinator'] },
  { to: '/recipients', label: 'Recipients', icon: HeartHandshake, roles: ['organiser', 'coordinator'] },
  { to: '/sites', label: 'Sites', icon: MapPin, roles: ['coordinator'] },
  { to: '/people', label: 'People', icon: Users, roles: ['coordinator'] },
  { to: '/mail', label: 'Mail', icon: Mail, roles: ['coordinator'] },
];
