import { Link } from 'react-router-dom';
import { PageHeader } from '../../components/ui/page-header';
import { paths } from '../../config/paths';

export function Component() {
  return (
    <>
      <PageHeader title="No page at this address" />
      <p className="text-hull-700">
        The link may be old or mistyped. <Link to={paths.fleet.href()} className="underline">Go to the fleet overview</Link>.
      </p>
    </>
  );
}
