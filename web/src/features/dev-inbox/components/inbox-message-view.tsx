import { useEffect, useRef } from 'react';
import { ErrorAlert } from '@/components/ui/error-alert';
import { PageSpinner } from '@/components/ui/page-spinner';
import { extractLinks, useInboxMessage } from '../api/get-inbox-message';
import { formatAddress, messageDate } from '../api/get-inbox';

function formatDateTime(iso: string | undefined) {
  if (!iso) return '';
  const date = new Date(iso);
  return Number.isNaN(date.getTime()) ? iso : date.toLocaleString();
}

export function InboxMessageView({ id }: { id: string }) {
  const message = useInboxMessage(id);
  const headingRef = useRef<HTMLHeadingElement>(null);

  useEffect(() => {
    if (message.data) headingRef.current?.focus();
  }, [message.data]);

  if (message.isPending) return <PageSpinner label="Opening the message" />;
  if (message.isError) return <ErrorAlert error={message.error} />;

  const data = message.data;
  const links = extractLinks(data.text);
  const htmlLinks = links.length ? [] : extractLinks(data.html?.match(/href="[^"]+"/g)?.map((h) => h.slice(6, -1)).join(' '));
  const allLinks = links.length ? links : htmlLinks;

  return (
    <article aria-labelledby="message-subject">
      <h2 id="message-subject" ref={headingRef} tabIndex={-1} className="h3 break-anywhere">
        {data.subject || '(no subject)'}
      </h2>
      <dl className="row mb-3">
        <dt className="col-sm-2">To</dt>
        <dd className="col-sm-10 break-anywhere">{formatAddress(data.to)}</dd>
        {data.from && (
          <>
            <dt className="col-sm-2">From</dt>
            <dd className="col-sm-10 break-anywhere">{formatAddress(data.from)}</dd>
          </>
        )}
        <dt className="col-sm-2">Date</dt>
        <dd className="col-sm-10">{formatDateTime(messageDate(data))}</dd>
      </dl>

      {allLinks.length > 0 && (
        <section aria-labelledby="message-links" className="mb-3">
          <h3 id="message-links" className="h5">
            Links in this message
          </h3>
          <ul>
            {allLinks.map((href) => (
              <li key={href} className="break-anywhere">
                <a href={href} className="tap-link">
                  {href}
                </a>
              </li>
            ))}
          </ul>
        </section>
      )}

      {data.html && (
        <section aria-labelledby="message-html" className="mb-3">
          <h3 id="message-html" className="h5">
            As the e-mail looks
          </h3>
          <iframe
            className="inbox-frame"
            title={`E-mail: ${data.subject}`}
            srcDoc={data.html}
            sandbox="allow-popups allow-popups-to-escape-sandbox allow-top-navigation-by-user-activation"
            referrerPolicy="no-referrer"
          />
        </section>
      )}

      {data.text && (
        <section aria-labelledby="message-text">
          <h3 id="message-text" className="h5">
            Plain text part
          </h3>
          <pre className="inbox-text" tabIndex={0}>
            {data.text}
          </pre>
        </section>
      )}
    </article>
  );
}
