// Baseline for `npm run bench`: the smallest Ink program — one line of text, then exit
// as soon as the first frame has been committed. Bundled by bench/build-hello.mjs.
import {useEffect, type ReactElement} from 'react';
import {render, Text, useApp} from 'ink';

function Hello(): ReactElement {
	const {exit} = useApp();
	useEffect(() => {
		exit();
	}, [exit]);
	return <Text>hello from ink</Text>;
}

const app = render(<Hello />);
await app.waitUntilExit();
