import { UsersScreen } from '../../components/screens/users-screen';

export default UsersScreen;
