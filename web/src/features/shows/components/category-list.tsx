import Badge from 'react-bootstrap/Badge';
import type { Category } from '../api/types';

/** Badge text for a category: judged, or on show only. */
export const judgedLabel = (judged: boolean) => (judged ? 'Judged' : 'Exhibit only');

/** The categories with their size rules, as a member reads them before entering. */
export function CategoryList({ categories }: { categories: Category[] }) {
  if (categories.length === 0) return <p>The show chair has not set up the categories yet.</p>;
  return (
    <ul className="plain-list category-list" aria-label="Categories">
      {categories.map((category) => (
        <li key={category.id} className="category-item" data-testid="category-item">
          <h3 className="h5 mb-1 d-flex flex-wrap align-items-center gap-2">
            <span>{category.name}</span>
            <Badge bg={category.judged ? 'primary' : 'light'} text={category.judged ? undefined : 'dark'} className="status-badge border">
              {judgedLabel(category.judged)}
            </Badge>
          </h3>
          {category.description && <p className="mb-1">{category.description}</p>}
          <p className="mb-0">
            <strong>Size:</strong> {category.sizeRuleText}
          </p>
          {category.minMakers != null && category.minMakers > 1 && <p className="mb-0">Made by at least {category.minMakers} people.</p>}
          {category.maxEntriesPerMember != null && (
            <p className="mb-0">
              Up to {category.maxEntriesPerMember} {category.maxEntriesPerMember === 1 ? 'quilt' : 'quilts'} per member in this category.
            </p>
          )}
        </li>
      ))}
    </ul>
  );
}
