import { FilingLayout } from '../../../../components/filings/filing-layout';

export default FilingLayout;
