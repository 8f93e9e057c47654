import { FilingOverviewScreen } from '../../../../components/screens/filing-overview-screen';

export default FilingOverviewScreen;
