import { SetPasswordScreen } from '../../components/screens/set-password-screen';

export default SetPasswordScreen;
