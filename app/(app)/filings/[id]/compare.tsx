import { FilingCompareScreen } from '../../../../components/screens/filing-compare-screen';

export default FilingCompareScreen;
