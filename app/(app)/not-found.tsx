import { NotFoundMessage } from '@/components/layout/not-found-message';

/** A board, site or page of the signed-in app that is not there: inside the app's own frame. */
export default function NotFound() {
  return (
    <div className="py-10">
      <NotFoundMessage />
    </div>
  );
}
