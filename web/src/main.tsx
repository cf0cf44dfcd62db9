import { StrictMode } from 'react'
import { createRoot } from 'react-dom/client'
import '@fontsource-variable/public-sans'
import '@fontsource/ibm-plex-mono/400.css'
import '@fontsource/ibm-plex-mono/600.css'
import './styles.css'
import { AppProvider } from '@/app/provider'
import { AppRouter } from '@/app/router'

const root = document.getElementById('root')
if (!root) throw new Error('Quietband: #root element missing from index.html')

createRoot(root).render(
  <StrictMode>
    <AppProvider>
      <AppRouter />
    </AppProvider>
  </StrictMode>,
)
