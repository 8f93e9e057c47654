import { FilingStepScreen } from '../../../../components/screens/filing-step-screen';

export default FilingStepScreen;
