import { NotFound } from '@/components/errors/not-found';

export default function NotFoundRoute() {
  return <NotFound />;
}
