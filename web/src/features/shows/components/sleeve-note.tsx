/** The show's hanging-sleeve rule, hard to miss: every quilt must come with one sewn on. */
export function SleeveNote({ text, headingId = 'sleeve-heading' }: { text: string; headingId?: string }) {
  return (
    <section className="sleeve-note mb-4" aria-labelledby={headingId} data-testid="sleeve-note">
      <h2 id={headingId} className="h4 mb-2">
        Sew a hanging sleeve on your quilt
      </h2>
      <p className="mb-0">{text}</p>
    </section>
  );
}
