import { FilingReviewScreen } from '../../../../components/screens/filing-review-screens';

export default FilingReviewScreen;
