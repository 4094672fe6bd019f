import { Navigate, Outlet, useLocation, useNavigate, useNavigation } from 'react-router-dom';
import { can, ROLE_LABELS, type Capability } from '../../../shared/roles';
import type { Me } from '../../../shared/schemas/auth';
import type { VesselSummary } from '../../../shared/schemas/vessels';
import { AppShell, type NavGroup, type NavItem } from '../../components/layouts/app-shell';
import { ErrorState, LoadingState } from '../../components/ui/states';
import { paths } from '../../config/paths';
import { useMe } from '../../features/auth/api/get-me';
import { useSignOut } from '../../features/auth/api/sign-out';
import { useVessels } from '../../features/vessels/api/get-vessels';

interface CompanyPage extends NavItem {
  capability: Capability;
}

// Company-wide pages and who sees them; a later page adds one line here.
const COMPANY_PAGES: CompanyPage[] = [
  { key: 'users', label: 'Users', href: paths.adminUsers.href(), capability: 'users:manage' },
  { key: 'outbox', label: 'Outbox', href: paths.adminOutbox.href(), capability: 'outbox:read' },
  { key: 'settings', label: 'Settings', href: paths.adminSettings.href(), capability: 'company:settings' },
  { key: 'audit', label: 'Audit trail', href: paths.audit.href(), capability: 'audit:read' },
  { key: 'fuel-prices', label: 'Fuel prices', href: paths.adminFuelPrices.href(), capability: 'fleet:read' },
];

// Reports and e-mail: the fleet views for roles that read reports, subscriptions for everyone.
const REPORT_PAGES: CompanyPage[] = [
  { key: 'fleet-benchmark', label: 'Fleet benchmark', href: paths.fleetBenchmark.href(), capability: 'reports:read' },
  { key: 'fleet-report', label: 'Fleet report', href: paths.fleetReport.href(), capability: 'reports:read' },
  { key: 'subscriptions', label: 'Subscriptions', href: paths.subscriptions.href(), capability: 'fleet:read' },
];

/** The navigation one member sees: the fleet, each vessel they may open, and the company pages their role allows. */
export function navigationFor(me: Me, vessels: readonly VesselSummary[]): NavGroup[] {
  const vesselItems: NavItem[] = vessels.map((v) => ({ key: `vessel-${v.id}`, label: v.name, href: paths.vessel.href(v.id) }));
  const groups: NavGroup[] = [
    {
      label: me.vesselIds === null ? 'Fleet' : vessels.length === 1 ? 'Your vessel' : 'Your vessels',
      items: [{ key: 'fleet', label: 'Overview', href: paths.fleet.href(), end: true }, { key: 'fleet-overhaul', label: 'Overhauls', href: paths.fleetOverhaul.href() }, ...vesselItems],
    },
  ];
  if (can(me.role, 'recommendations:run') && vessels.length > 0) groups.push({ label: 'Recommend', items: vessels.flatMap((v) => [{ key: `recommend-${v.id}`, label: `${v.name}: one load`, href: paths.vesselRecommend.href(v.id) }, { key: `guideline-${v.id}`, label: `${v.name}: guideline`, href: paths.vesselGuideline.href(v.id) }, { key: `plans-${v.id}`, label: `${v.name}: voyage plans`, href: paths.vesselPlans.href(v.id) }, { key: `rules-${v.id}`, label: `${v.name}: rules and set status`, href: paths.vesselRules.href(v.id) }]) });
  const reports = REPORT_PAGES.filter((p) => can(me.role, p.capability)).map(({ capability: _c, ...item }) => item);
  if (reports.length > 0) groups.push({ label: 'Reports', items: reports });
  const company = COMPANY_PAGES.filter((p) => can(me.role, p.capability)).map(({ capability: _c, ...item }) => item);
  if (company.length > 0) groups.push({ label: 'Company', items: company });
  return groups;
}

function SignedInShell({ me }: { me: Me }) {
  const vessels = useVessels();
  const signOut = useSignOut();
  const navigate = useNavigate();
  const navigation = useNavigation();

  return (
    <AppShell
      nav={navigationFor(me, vessels.data ?? [])}
      userName={me.user.name}
      userDetail={`${ROLE_LABELS[me.role]} · ${me.company.name}`}
      signingOut={signOut.isPending}
      onSignOut={() => signOut.mutate(undefined, { onSettled: () => navigate(paths.signIn.href(), { replace: true }) })}
    >
      {navigation.state === 'loading' ? (
        <div className="fixed inset-x-0 top-0 z-10 h-1 animate-pulse bg-brass-400" role="progressbar" aria-label="Loading page" />
      ) : null}
      <Outlet context={me} />
    </AppShell>
  );
}

/** Layout of every signed-in page; without a session it sends the visitor to sign-in and back here afterwards. */
export function AppRoot() {
  const me = useMe();
  const location = useLocation();

  if (me.isPending) return <LoadingState label="Checking your session…" />;
  if (me.isError) {
    return (
      <div className="mx-auto max-w-form px-gutter py-bay">
        <ErrorState error={me.error} onRetry={() => void me.refetch()} title="Kilowatch cannot reach its server" />
      </div>
    );
  }
  if (!me.data) return <Navigate to={paths.signIn.href(location.pathname + location.search)} replace />;
  return <SignedInShell me={me.data} />;
}
