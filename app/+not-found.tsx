import { NotFoundScreen } from '../components/screens/not-found-screen';

export default NotFoundScreen;
