import { ActivityScreen } from '../../components/screens/activity-screen';

export default ActivityScreen;
