import { FilingNewScreen } from '../../../components/screens/filing-new-screen';

export default FilingNewScreen;
