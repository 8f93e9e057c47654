import { FilingReadinessScreen } from '../../../../components/screens/filing-review-screens';

export default FilingReadinessScreen;
