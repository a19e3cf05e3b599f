import { Link, useParams, useSearchParams } from 'react-router-dom';
import { usePageTitle } from '@/components/ui/page-title';
import { paths } from '@/config/paths';
import { PaymentResult } from '@/features/dues/components/payment-result';

/** Where the payment service sends her back: ?invoice=ID&session=… */
export default function DuesReturnRoute() {
  const { guildId = '' } = useParams();
  const [search] = useSearchParams();
  const invoiceId = search.get('invoice')?.trim() ?? '';
  usePageTitle('Your payment');
  const duesHref = paths.dues.getHref(guildId);

  if (!/^\d+$/.test(invoiceId)) {
    return (
      <>
        <h1>We could not tell which payment this was</h1>
        <p className="fs-5">Your dues page shows every payment you have made, with its receipt.</p>
        <Link to={duesHref} className="btn btn-primary">
          Go to my dues
        </Link>
      </>
    );
  }
  return <PaymentResult guildId={guildId} invoiceId={invoiceId} duesHref={duesHref} />;
}
