import { FilingsListScreen } from '../../../components/screens/filings-list-screen';

export default FilingsListScreen;
