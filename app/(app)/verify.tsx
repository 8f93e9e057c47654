import { PackageVerifyScreen } from '../../components/screens/package-verify-screen';

export default PackageVerifyScreen;
