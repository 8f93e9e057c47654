import { Redirect } from 'expo-router';

/** Home is the organisation's filings. */
export default function Home() {
  return <Redirect href="/filings" />;
}
