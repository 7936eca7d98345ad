import { Stack } from 'expo-router';
import { StyleSheet, Text, View } from 'react-native';

export default function Index() {
  return (
    <View style={styles.page}>
      <Stack.Screen options={{ title: 'Bare app' }} />
      <Text role="heading" style={styles.title}>Bare app</Text>
      <Text>One screen, the same providers.</Text>
    </View>
  );
}

const styles = StyleSheet.create({
  page: { flex: 1, alignItems: 'center', justifyContent: 'center', gap: 12 },
  title: { fontFamily: 'Lora_700Bold', fontSize: 27 },
});
