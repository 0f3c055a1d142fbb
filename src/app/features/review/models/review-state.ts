// How a review state shows: always an icon beside its word (never a colour alone), the same on every screen.
import type { ReviewState } from '../../../../../shared/enums';

export const REVIEW_STATE_ICONS: Record<ReviewState, string> = {
  none: 'hourglass_empty',
  approved: 'verified',
  questioned: 'help',
  answered: 'forum',
};
