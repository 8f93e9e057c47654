import { ProfileScreen } from '../../components/screens/profile-screen';

export default ProfileScreen;
